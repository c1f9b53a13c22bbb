import { COMPANY_MAIL_HEADER } from '../../lib/mailer';
import type { AppContext } from '../../context';
import type { Tx } from '../../db/client';
import type { ReminderStatus } from '../../../shared/schemas/reminders';
import { formatCalendarDate } from '../../../shared/format/dates';
import { findCompany } from '../../core/tenant-finders';
import { recordAudit } from '../../core/audit-log';
import { appendTimelineEvent } from '../../core/timeline';
import { remindersRepository as repo } from './reminders.repository';
import { reminderHtml, reminderSubject, reminderText, type ReminderLine } from './reminder-email';
import { unsubscribeToken } from './unsubscribe-token';

type Pending = Awaited<ReturnType<typeof repo.pendingWithDetails>>[number];
type Outcome = { status: Exclude<ReminderStatus, 'pending'>; toEmail?: string; messageId?: string; error?: string };

/** Both addresses carry the signed token; the API one answers the RFC 8058 one-click POST. */
export function unsubscribeUrls(ctx: AppContext, customerId: string) {
  const token = unsubscribeToken(ctx.config.BETTER_AUTH_SECRET, customerId);
  return { page: `${ctx.config.BASE_URL}/unsubscribe/${token}`, oneClick: `${ctx.config.BASE_URL}/api/unsubscribe/${token}` };
}


const SUMMARY: Record<Outcome['status'], (what: string, to?: string) => string> = {
  sent: (what, to) => `${what} reminder e-mailed to ${to}`,
  failed: (what) => `${what} reminder could not be e-mailed; it will be tried again`,
  opted_out: (what) => `${what} reminder not sent: the customer has opted out of reminder e-mails`,
  no_email: (what) => `${what} reminder not sent: no e-mail address on file`,
};

/**
 * Sends the given pending reminders: one e-mail per customer listing all of theirs, then each row's outcome and its
 * timeline event (and, when the office asked, an audit row) in one transaction per row.
 */
export async function deliverReminders(ctx: AppContext, q: { companyId: string; today: string; ids: string[]; actorId?: string }) {
  const pending = await repo.pendingWithDetails(ctx.db, q.companyId, q.ids);
  const counts = { sent: 0, failed: 0, opted_out: 0, no_email: 0, emails: 0 };
  if (!pending.length) return counts;
  const company = (await findCompany(ctx.db, q.companyId))!;
  const byCustomer = new Map<string, Pending[]>();
  for (const p of pending) byCustomer.set(p.customer_id, [...(byCustomer.get(p.customer_id) ?? []), p]);
  for (const rows of byCustomer.values()) {
    const first = rows[0]!;
    let outcome: Outcome;
    if (first.reminders_opt_out) outcome = { status: 'opted_out' };
    else if (!first.email) outcome = { status: 'no_email' };
    else outcome = await sendOne(ctx, company, q.today, rows, first.email);
    if (outcome.status === 'sent') counts.emails += 1;
    for (const row of rows) {
      await ctx.db.transaction((tx) => finish(tx, q.companyId, row, outcome, q.actorId));
      counts[outcome.status] += 1;
    }
  }
  return counts;
}

async function sendOne(ctx: AppContext, company: { id: string; name: string; phone: string }, today: string, rows: Pending[], to: string): Promise<Outcome> {
  const lines: ReminderLine[] = rows.map((r) => ({
    kind: r.kind,
    dueOn: r.due_on,
    partLabel: r.part_label,
    dueKind: r.due_kind,
    failedOnCondition: r.condition_failed === true,
    appliance: { kind: r.appliance_kind, fuel: r.fuel, street: r.street, town: r.town },
  }));
  const urls = unsubscribeUrls(ctx, rows[0]!.customer_id);
  const input = { company, customerName: rows[0]!.customer_name, today, lines, unsubscribeUrl: urls.page };
  try {
    const info = await ctx.mailer.send({
      to,
      subject: reminderSubject(input),
      text: reminderText(input),
      html: reminderHtml(input),
      headers: {
        'List-Unsubscribe': `<${urls.oneClick}>`,
        'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
        [COMPANY_MAIL_HEADER]: company.id,
      },
    });
    return { status: 'sent', toEmail: to, messageId: info.messageId };
  } catch (err) {
    ctx.logger.warn({ err, companyId: company.id }, 'reminder e-mail failed');
    return { status: 'failed', toEmail: to, error: err instanceof Error ? err.message.slice(0, 500) : String(err) };
  }
}

async function finish(tx: Tx, companyId: string, row: Pending, outcome: Outcome, actorId?: string) {
  const now = new Date();
  const updated = await repo.finish(tx, row.id, {
    status: outcome.status,
    toEmail: outcome.toEmail ?? null,
    messageId: outcome.messageId ?? null,
    lastError: outcome.error ?? null,
    sentAt: outcome.status === 'sent' ? now : null,
    attempts: outcome.status === 'sent' || outcome.status === 'failed' ? row.attempts + 1 : row.attempts,
  });
  const what = row.kind === 'annual_service' ? 'Annual service' : `Part due (${row.part_label ?? 'part'}, ${formatCalendarDate(row.due_on)})`;
  await appendTimelineEvent(tx, {
    companyId,
    applianceId: row.appliance_id,
    occurredAt: now,
    kind: 'reminder',
    summary: SUMMARY[outcome.status](what, outcome.toEmail),
    refId: row.id,
    data: { reminderId: row.id, reminderKind: row.kind, dueOn: row.due_on, status: outcome.status, trigger: updated.trigger },
    actorId: actorId ?? null,
  });
  if (actorId) {
    await recordAudit(tx, {
      companyId,
      actorId,
      action: 'send',
      entity: 'reminder',
      entityId: row.id,
      changes: { status: outcome.status, toEmail: outcome.toEmail ?? null, dueOn: row.due_on, applianceId: row.appliance_id },
    });
  }
}

import type { AppContext } from '../../context';
import { HttpError, badRequest, conflict, notFound } from '../../lib/http-error';
import { addDays } from '../../../shared/trade/iso-date';
import { type ReminderDto, type RemindersPageDto } from '../../../shared/schemas/reminders';
import { findCompany } from '../../core/tenant-finders';
import { companyDueClock, companyToday } from '../../core/company-today';
import { typeLabelFor } from '../../core/type-label';
import { remindersRepository as repo, type NewReminder, type ReminderRow } from './reminders.repository';
import { deliverReminders } from './deliver-reminders';

/** After this many failed tries a reminder stays 'failed' until the office sends it by hand. */
export const MAX_SEND_ATTEMPTS = 5;

const partLabel = (typeCode: string, catalogLabel: string | null, specKey: string) =>
  `${typeLabelFor(typeCode, catalogLabel)}${specKey ? `, ${specKey}` : ''}`;

export function toReminderDto({ reminder: r, customerName }: { reminder: ReminderRow; customerName: string }): ReminderDto {
  return {
    id: r.id,
    applianceId: r.applianceId,
    customerId: r.customerId,
    customerName,
    kind: r.kind,
    partLabel: r.partLabel,
    dueOn: r.dueOn,
    status: r.status,
    trigger: r.trigger,
    toEmail: r.toEmail,
    attempts: r.attempts,
    lastError: r.lastError,
    sentAt: r.sentAt?.toISOString() ?? null,
    createdAt: r.createdAt.toISOString(),
  };
}

/**
 * One company's scheduled run for `today` (the company's own date): records each reminder that fell due once, retries
 * failed ones, and sends each customer one e-mail listing everything new for them.
 */
export async function runReminders(ctx: AppContext, options: { companyId: string; today?: string }) {
  const { companyId } = options;
  const clock = await companyDueClock(ctx.db, companyId);
  const today = options.today ?? clock.today;
  // Parts are reminded once they come inside the company's "due soon" window (companies.due_soon_days).
  const [annual, parts] = await Promise.all([
    repo.annualDue(ctx.db, companyId, today),
    repo.partsDue(ctx.db, companyId, addDays(today, clock.dueSoonDays)),
  ]);
  const rows: NewReminder[] = [
    ...annual.map((a): NewReminder => ({ companyId, applianceId: a.appliance_id, customerId: a.customer_id, kind: 'annual_service', partKey: '', dueOn: a.due_on, trigger: 'schedule' })),
    ...parts.map((p): NewReminder => ({
      companyId,
      applianceId: p.appliance_id,
      customerId: p.customer_id,
      kind: 'part_due',
      partKey: p.component_id,
      componentId: p.component_id,
      partLabel: partLabel(p.type_code, p.catalog_label, p.spec_key),
      dueOn: p.due_on,
      trigger: 'schedule',
    })),
  ];
  const created = await repo.insertNew(ctx.db, rows);
  const failed = await repo.claim(ctx.db, { companyId, from: ['failed'], maxAttempts: MAX_SEND_ATTEMPTS });
  const reachable = await repo.claimNowReachable(ctx.db, companyId, rows);
  const retried = [...failed, ...reachable];
  const ids = [...created, ...retried].map((r) => r.id);
  const outcome = await deliverReminders(ctx, { companyId, today, ids });
  return { created: created.length, retried: retried.length, ...outcome };
}

const encodeCursor = (createdAt: Date, id: string) => `${createdAt.toISOString()}_${id}`;
function decodeCursor(cursor: string) {
  const match = /^(\d{4}-\d{2}-\d{2}T[\d:.]+Z)_([0-9a-f-]{36})$/i.exec(cursor);
  const createdAt = match ? new Date(match[1]) : null;
  if (!match || !createdAt || Number.isNaN(createdAt.getTime())) throw badRequest('The page cursor is not valid.', { before: ['Not a valid cursor.'] });
  return { createdAt, id: match[2] };
}

export function remindersService(ctx: AppContext) {
  return {
    async list(companyId: string, q: { limit: number; before?: string; applianceId?: string }): Promise<RemindersPageDto> {
      const rows = await repo.list(ctx.db, { companyId, applianceId: q.applianceId, before: q.before ? decodeCursor(q.before) : null, limit: q.limit + 1 });
      const page = rows.slice(0, q.limit);
      const last = page.at(-1);
      return { items: page.map(toReminderDto), nextCursor: rows.length > q.limit && last ? encodeCursor(last.reminder.createdAt, last.reminder.id) : null };
    },

    /** The office's "send reminder" for one appliance's current annual-service period. */
    async sendAnnualFromOffice(actor: { userId: string; companyId: string }, applianceId: string): Promise<ReminderDto> {
      const { companyId } = actor;
      const found = await repo.annualForAppliance(ctx.db, companyId, applianceId);
      if (!found) throw notFound('Appliance');
      if (found.appliance_status !== 'in_service') throw conflict('This appliance is not in service, so no reminder is sent.');
      if (found.reminders_opt_out) throw conflict('This customer has opted out of reminder e-mails.');
      if (!found.email) throw conflict('This customer has no e-mail address on file. Add one on the customer’s page first.');
      const key = { applianceId, kind: 'annual_service' as const, partKey: '', dueOn: found.due_on };
      const set = { trigger: 'office' as const, requestedBy: actor.userId };
      const [created] = await repo.insertNew(ctx.db, [{ companyId, customerId: found.customer_id, ...key, ...set }]);
      let id = created?.id;
      if (!id) {
        const existing = await repo.findExisting(ctx.db, key);
        // A reminder that could not go out before (failed, no address, opted out then) may be sent by hand now.
        const [claimed] = existing ? await repo.claim(ctx.db, { companyId, from: ['failed', 'no_email', 'opted_out'], ids: [existing.id], set }) : [];
        if (!claimed) throw alreadySent(existing);
        id = claimed.id;
      }
      const today = await companyToday(ctx.db, companyId);
      await deliverReminders(ctx, { companyId, today, ids: [id], actorId: actor.userId });
      return toReminderDto((await repo.findWithCustomer(ctx.db, companyId, id))!);
    },
  };
}

function alreadySent(existing: ReminderRow | null): HttpError {
  if (existing?.status === 'sent' && existing.sentAt) {
    return conflict(`This period’s annual-service reminder was already sent on ${existing.sentAt.toISOString().slice(0, 10)} to ${existing.toEmail ?? 'the customer'}.`, {
      reminderId: existing.id,
    });
  }
  return conflict('This period’s annual-service reminder is being sent right now.');
}

/** Every company's run, each on its own date; one company's failure does not stop the others. */
export async function runRemindersForCompanies(ctx: AppContext, companyIds: string[]) {
  const results: { companyId: string; ok: boolean }[] = [];
  for (const companyId of companyIds) {
    try {
      const company = await findCompany(ctx.db, companyId);
      if (!company) continue;
      const outcome = await runReminders(ctx, { companyId });
      if (outcome.created || outcome.retried) ctx.logger.info({ companyId, ...outcome }, 'reminder run');
      results.push({ companyId, ok: true });
    } catch (err) {
      ctx.logger.warn({ err, companyId }, 'reminder run failed for one company');
      results.push({ companyId, ok: false });
    }
  }
  return results;
}

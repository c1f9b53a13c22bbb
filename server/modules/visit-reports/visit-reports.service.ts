import crypto from 'node:crypto';
import type { AppContext } from '../../context';
import type { DbOrTx, Tx } from '../../db/client';
import { conflict, notFound } from '../../lib/http-error';
import { COMPANY_MAIL_HEADER } from '../../lib/mailer';
import { mailDelivery, type MailDelivery } from '../../../shared/schemas/mail';
import { recordAudit } from '../../core/audit-log';
import { unsubscribeUrls } from '../reminders';
import { hashShareToken, resolveShareToken } from '../share-links';
import { insertShareLink } from '../share-links';
import { loadVisitReport, type VisitReport } from './visit-report-content';
import { visitReportHtml, visitReportSubject, visitReportText } from './visit-report-mail';
import { renderVisitReportPdf, visitReportFilename } from './visit-report-pdf';

type Member = { companyId: string; userId: string };
export type ReportPdf = { pdf: Uint8Array; filename: string };
/** Why a report was not e-mailed, in the words the reminders use for the same two cases. */
export type ReportMailOutcome = { mailId: string } | { skipped: 'opted_out' | 'no_email' };

/** The link in the e-mail opens the share page; it lasts as long as a household keeps a paper report handy. */
const REPORT_LINK_DAYS = 365;

async function pdfOf(report: VisitReport): Promise<ReportPdf> {
  return { pdf: await renderVisitReportPdf(report), filename: visitReportFilename(report) };
}

/**
 * Queues the report e-mail (PDF attached, linking a fresh share page) inside the caller's transaction, unless the
 * customer opted out of our e-mails or has no address, as reminders do. The caller delivers it after the commit.
 */
export async function queueVisitReportMail(ctx: AppContext, tx: Tx, actor: Member, visitId: string): Promise<ReportMailOutcome> {
  const report = await loadVisitReport(tx, actor.companyId, visitId);
  const { recipient } = report;
  const skipped = recipient.optedOut ? 'opted_out' : !recipient.email ? 'no_email' : null;
  if (skipped) {
    await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'visit_report_not_mailed', entity: 'visit', entityId: visitId, changes: { reason: skipped } });
    return { skipped };
  }
  const token = crypto.randomBytes(32).toString('base64url');
  const link = await insertShareLink(tx, {
    companyId: actor.companyId,
    applianceId: recipient.applianceId,
    tokenHash: hashShareToken(token),
    label: `Visit report e-mail, ${report.visit.visitedOn}`,
    expiresAt: new Date(Date.now() + REPORT_LINK_DAYS * 86_400_000),
    createdBy: actor.userId,
  });
  const links = { shareUrl: `${ctx.config.BASE_URL}/s/${token}`, unsubscribeUrl: unsubscribeUrls(ctx, recipient.customerId).page };
  const { pdf, filename } = await pdfOf(report);
  const mailId = await ctx.mail.enqueue(
    tx,
    {
      to: recipient.email!,
      subject: visitReportSubject(report),
      text: visitReportText(report, links),
      html: visitReportHtml(report, links),
      headers: {
        'List-Unsubscribe': `<${unsubscribeUrls(ctx, recipient.customerId).oneClick}>`,
        'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
        [COMPANY_MAIL_HEADER]: actor.companyId,
      },
      attachments: [{ filename, contentType: 'application/pdf', content: Buffer.from(pdf).toString('base64') }],
    },
    { kind: 'visit_report', companyId: actor.companyId, refId: visitId },
  );
  await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'create', entity: 'share_link', entityId: link.id, changes: { applianceId: recipient.applianceId, expiresAt: link.expiresAt, for: 'visit_report_mail' } });
  await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'visit_report_mailed', entity: 'visit', entityId: visitId, changes: { mailId } });
  return { mailId };
}

async function visitOfAppliance(db: DbOrTx, companyId: string, applianceId: string, visitId: string) {
  const report = await loadVisitReport(db, companyId, visitId);
  if (report.recipient.applianceId !== applianceId) throw notFound('Visit report');
  return report;
}

export function visitReportsService(ctx: AppContext) {
  return {
    forMember: async (actor: Member, visitId: string) => pdfOf(await loadVisitReport(ctx.db, actor.companyId, visitId)),
    forAppliance: async (companyId: string, applianceId: string, visitId: string) => pdfOf(await visitOfAppliance(ctx.db, companyId, applianceId, visitId)),
    forShareToken: async (token: string, visitId: string) => {
      const link = await resolveShareToken(ctx.db, token);
      return pdfOf(await visitOfAppliance(ctx.db, link.companyId, link.applianceId, visitId));
    },
    /** The office sends the report again on request; an opted-out customer or one without an address is a 409. */
    async email(actor: Member, visitId: string): Promise<{ mail: MailDelivery }> {
      // Refused inside the transaction, so a refusal writes nothing.
      const mailId = await ctx.db.transaction(async (tx) => {
        const outcome = await queueVisitReportMail(ctx, tx, actor, visitId);
        if ('mailId' in outcome) return outcome.mailId;
        throw conflict(
          outcome.skipped === 'opted_out'
            ? 'This customer has opted out of e-mails from us.'
            : 'This customer has no e-mail address on file. Add one on the customer’s page first.',
        );
      });
      return { mail: mailDelivery(await ctx.mail.deliver(mailId)) };
    },
  };
}

import type { AppContext } from '../../context';
import type { Tx } from '../../db/client';
import { HttpError, notFound } from '../../lib/http-error';
import { SHARE_LINK_REQUESTS_PER_DAY } from '../../../shared/schemas/service-request-limits';
import type {
  ServiceRequestCreatedDto,
  ServiceRequestDto,
  ServiceRequestPage,
  ServiceRequestStatus,
  ServiceRequestVia,
} from '../../../shared/schemas/service-requests';
import { recordAudit } from '../../core/audit-log';
import { appendTimelineEvent } from '../../core/timeline';
import { serviceRequestMail } from './service-request-mail';
import { decodeRequestCursor, encodeRequestCursor, serviceRequestDto } from './service-request-dto';
import { serviceRequestsRepository as repo } from './service-requests.repository';
import { findCompanyContact } from '../../core/tenant-finders';

type Source = { companyId: string; applianceId: string } & (
  | { via: Extract<ServiceRequestVia, 'share_link'>; shareLinkId: string }
  | { via: Extract<ServiceRequestVia, 'homeowner_account'>; requesterUserId: string }
  | { via: Extract<ServiceRequestVia, 'booking_reply'>; bookingId: string }
);
type Input = { contactName: string; contactPhone?: string | null; contactEmail?: string | null; preferredTimes?: string | null; message?: string | null };
type Member = { companyId: string; userId: string };

const DAY_MS = 86_400_000;
const VIA_SUMMARY: Record<ServiceRequestVia, string> = {
  share_link: 'through the share link',
  homeowner_account: 'from their sign-in',
  booking_reply: 'about a booked time that does not suit them',
};
const whoOf = (source: Source) =>
  source.via === 'share_link'
    ? { shareLinkId: source.shareLinkId }
    : source.via === 'homeowner_account'
      ? { requesterUserId: source.requesterUserId }
      : { aboutBookingId: source.bookingId };

export function serviceRequestsService(ctx: AppContext) {
  /** Written in the request's own transaction, so a request is never stored without its e-mail to the office. */
  async function queueOfficeMail(tx: Tx, row: Awaited<ReturnType<typeof repo.insert>>, appliance: NonNullable<Awaited<ReturnType<typeof repo.applianceContext>>>) {
    const recipients = await repo.officeRecipients(tx, row.companyId);
    if (!recipients.length) {
      ctx.logger.warn({ serviceRequestId: row.id }, 'no active owner or manager to tell about a service request');
      return null;
    }
    const mail = { to: recipients.join(', '), ...serviceRequestMail(ctx.config.BASE_URL, row, appliance) };
    return ctx.mail.enqueue(tx, mail, { kind: 'service_request', companyId: row.companyId, refId: row.id });
  }

  /** Tried at once after the commit; the mail queue marks office_notified_at when the server takes it, now or later. */
  async function tryOfficeMail(mailId: string | null, serviceRequestId: string) {
    if (!mailId) return;
    try {
      await ctx.mail.deliver(mailId);
    } catch (err) {
      ctx.logger.error({ err, serviceRequestId }, 'the e-mail to the office stays queued; the request is kept in the list');
    }
  }

  return {
    async create(source: Source, input: Input): Promise<ServiceRequestCreatedDto> {
      const company = await findCompanyContact(ctx.db, source.companyId);
      const { row, mailId } = await ctx.db.transaction(async (tx) => {
        const appliance = await repo.applianceContext(tx, source.companyId, source.applianceId);
        if (!appliance) throw notFound('Appliance');
        const who = whoOf(source);
        await repo.lockFor(tx, Object.values(who)[0]);
        if ((await repo.countSince(tx, who, new Date(Date.now() - DAY_MS))) >= SHARE_LINK_REQUESTS_PER_DAY) {
          throw new HttpError(
            429,
            'too_many_requests',
            `${SHARE_LINK_REQUESTS_PER_DAY} requests were already sent today, and ${company.name} has them. For anything more, call ${company.phone}.`,
          );
        }
        const actorId = source.via === 'homeowner_account' ? source.requesterUserId : null;
        const row = await repo.insert(tx, {
          companyId: source.companyId,
          applianceId: source.applianceId,
          customerId: appliance.customerId,
          via: source.via,
          shareLinkId: source.via === 'share_link' ? source.shareLinkId : null,
          aboutBookingId: source.via === 'booking_reply' ? source.bookingId : null,
          requesterUserId: actorId,
          contactName: input.contactName,
          contactPhone: input.contactPhone ?? null,
          contactEmail: input.contactEmail ?? null,
          preferredTimes: input.preferredTimes ?? null,
          message: input.message ?? null,
        });
        await appendTimelineEvent(tx, {
          companyId: source.companyId,
          applianceId: source.applianceId,
          occurredAt: row.createdAt,
          kind: 'note',
          summary: `Service request from ${input.contactName} ${VIA_SUMMARY[source.via]}`,
          refId: row.id,
          data: { serviceRequest: { via: source.via } },
          homeownerVisible: false,
          actorId,
        });
        await recordAudit(tx, {
          companyId: source.companyId,
          actorId,
          action: 'create',
          entity: 'service_request',
          entityId: row.id,
          changes: { via: source.via, applianceId: source.applianceId, shareLinkId: row.shareLinkId },
        });
        return { row, mailId: await queueOfficeMail(tx, row, appliance) };
      });
      await tryOfficeMail(mailId, row.id);
      return { id: row.id, company: { name: company.name, phone: company.phone } };
    },

    async list(actor: Member, q: { status?: ServiceRequestStatus; after?: string; limit: number }): Promise<ServiceRequestPage> {
      const after = q.after ? decodeRequestCursor(q.after) : undefined;
      const [rows, newCount] = await Promise.all([
        repo.list(ctx.db, actor.companyId, { status: q.status, after, limit: q.limit + 1 }),
        repo.countNew(ctx.db, actor.companyId),
      ]);
      const page = rows.slice(0, q.limit);
      const last = page[page.length - 1];
      return {
        items: page.map(serviceRequestDto),
        nextCursor: rows.length > q.limit && last ? encodeRequestCursor(last.createdAtKey, last.request.id) : null,
        newCount,
      };
    },

    async setStatus(actor: Member, id: string, status: Exclude<ServiceRequestStatus, 'new'>): Promise<ServiceRequestDto> {
      await ctx.db.transaction(async (tx) => {
        const before = await repo.find(tx, actor.companyId, id);
        if (!before) throw notFound('Service request');
        await repo.setStatus(tx, actor.companyId, id, { status, handledBy: actor.userId, handledAt: new Date() });
        await recordAudit(tx, {
          companyId: actor.companyId,
          actorId: actor.userId,
          action: 'update',
          entity: 'service_request',
          entityId: id,
          changes: { before: { status: before.status }, after: { status } },
        });
      });
      return serviceRequestDto((await repo.findListed(ctx.db, actor.companyId, id))!);
    },
  };
}

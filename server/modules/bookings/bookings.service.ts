import type { AppContext } from '../../context';
import type { DbOrTx, Tx } from '../../db/client';
import { HttpError, forbidden, notFound, validationFailed } from '../../lib/http-error';
import { instantOfLocalDateTime, todayInTimeZone } from '../../../shared/dates';
import { formatInstant } from '../../../shared/format/dates';
import { addDays } from '../../../shared/trade/iso-date';
import {
  MAX_BOOKING_DAYS_AHEAD,
  MAX_BOOKING_MINUTES,
  type BookingDto,
  type BookingInput,
  type BookingListDto,
  type BookingMoveInput,
  type LoadListDto,
  type RoundDto,
} from '../../../shared/schemas/bookings';
import type { Principal } from '../../../shared/schemas/roles';
import { recordAudit } from '../../core/audit-log';
import { appendTimelineEvent } from '../../core/timeline';
import { bookingDtos, loadList } from './booking-dto';
import { bookingsRepository as repo, type BookingRow } from './bookings.repository';
import { isDeadlock, isExclusionViolation } from './pg-error';
import { queueBookingNotice, type QueuedNotice } from '../booking-notices';

type Member = Extract<Principal, { kind: 'member' }>;
const DAY_MS = 86_400_000;
const isOffice = (m: Member) => m.role === 'owner' || m.role === 'manager';

type Change = 'booked' | 'moved' | 'confirmed' | 'cancelled' | 'no_access';
const CHANGE_WORDS: Record<Change, string> = {
  booked: 'Visit booked',
  moved: 'Booking moved',
  confirmed: 'Booking confirmed',
  cancelled: 'Booking cancelled',
  no_access: 'No access at the booked visit',
};

export function bookingsService(ctx: AppContext) {
  async function timeZoneOf(db: DbOrTx, companyId: string) {
    const company = await repo.company(db, companyId);
    if (!company) throw notFound('Company');
    return company.timeZone;
  }

  async function dtos(db: DbOrTx, companyId: string, rows: BookingRow[], timeZone: string, dueBy?: string) {
    const lastEnd = rows.reduce((max, b) => Math.max(max, b.endsAt.getTime()), 0);
    const due = dueBy ?? todayInTimeZone(timeZone, new Date(lastEnd || Date.now()));
    const details = await repo.details(db, companyId, rows, due);
    return { list: bookingDtos(rows, details, timeZone), details };
  }

  async function one(db: DbOrTx, companyId: string, row: BookingRow): Promise<BookingDto> {
    const timeZone = await timeZoneOf(db, companyId);
    return (await dtos(db, companyId, [row], timeZone)).list[0];
  }

  /** Turns the wall-clock window into instants and refuses the past, the far future and a day longer than 24 h. */
  function windowOf(timeZone: string, input: { start: string; end: string }) {
    const startsAt = instantOfLocalDateTime(timeZone, input.start);
    const endsAt = instantOfLocalDateTime(timeZone, input.end);
    const now = Date.now();
    if (startsAt.getTime() < now) throw validationFailed({ start: ['A booking cannot start in the past.'] });
    if (startsAt.getTime() > now + MAX_BOOKING_DAYS_AHEAD * DAY_MS)
      throw validationFailed({ start: [`Book at most ${MAX_BOOKING_DAYS_AHEAD} days ahead.`] });
    // A change of clocks can stretch a wall-clock window past 24 real hours.
    if (endsAt.getTime() - startsAt.getTime() > MAX_BOOKING_MINUTES * 60_000) throw validationFailed({ end: ['A booking cannot be longer than a day.'] });
    if (endsAt <= startsAt) throw validationFailed({ end: ['The end must be after the start.'] });
    return { startsAt, endsAt };
  }

  async function technicianFor(db: DbOrTx, actor: Member, technicianId: string) {
    if (!isOffice(actor) && technicianId !== actor.userId) throw forbidden('Technicians book follow-ups for themselves only.');
    const tech = await repo.activeTechnician(db, actor.companyId, technicianId);
    if (!tech) throw validationFailed({ technicianId: ['Choose someone on your team.'] });
    return tech;
  }

  async function clashError(db: DbOrTx, timeZone: string, technicianId: string, startsAt: Date, endsAt: Date, exceptId?: string) {
    const other = await repo.clash(db, technicianId, startsAt, endsAt, exceptId);
    const when = other ? `${formatInstant(other.startsAt, timeZone)}–${formatInstant(other.endsAt, timeZone).split(', ').pop()}` : '';
    const message = other
      ? `This technician is already booked ${when} at ${other.street}, ${other.town}. Choose another time or technician.`
      : 'This technician is already booked at that time. Choose another time or technician.';
    return new HttpError(409, 'booking_clash', message, { start: [message], ...(other ? { clashBookingId: [other.id] } : {}) });
  }

  /** Runs a write that may overlap another booking; the database's exclusion constraint is the judge. */
  async function guarded<T>(timeZone: string, technicianId: string, startsAt: Date, endsAt: Date, exceptId: string | undefined, write: (tx: Tx) => Promise<T>) {
    const attempt = async (): Promise<T> => {
      try {
        return await ctx.db.transaction(write);
      } catch (err) {
        if (isExclusionViolation(err)) throw await clashError(ctx.db, timeZone, technicianId, startsAt, endsAt, exceptId);
        throw err;
      }
    };
    try {
      return await attempt();
    } catch (err) {
      // Cancelled by PostgreSQL's deadlock detector while racing a clashing booking: once more decides which it is.
      if (isDeadlock(err)) return attempt();
      throw err;
    }
  }

  async function recordChange(tx: Tx, actor: Member, booking: BookingRow, change: Change, timeZone: string, extra: Record<string, unknown> = {}) {
    const applianceIds = (await repo.applianceIdsOf(tx, booking.id)).map((r) => r.applianceId);
    const when = formatInstant(booking.startsAt, timeZone);
    for (const applianceId of applianceIds) {
      await appendTimelineEvent(tx, {
        companyId: actor.companyId,
        applianceId,
        occurredAt: new Date(),
        kind: 'booking',
        refId: booking.id,
        summary: `${CHANGE_WORDS[change]}: ${when}${booking.statusReason && (change === 'cancelled' || change === 'no_access') ? ` (${booking.statusReason})` : ''}`,
        data: { change, startsAt: booking.startsAt.toISOString(), endsAt: booking.endsAt.toISOString(), technicianId: booking.technicianId, ...extra },
        actorId: actor.userId,
      });
    }
    await recordAudit(tx, {
      companyId: actor.companyId,
      actorId: actor.userId,
      action: change,
      entity: 'booking',
      entityId: booking.id,
      changes: { status: booking.status, startsAt: booking.startsAt.toISOString(), endsAt: booking.endsAt.toISOString(), technicianId: booking.technicianId, applianceIds, ...extra },
    });
  }

  /** The homeowner's e-mail is tried once the booking change has committed; the mail-delivery job retries it. */
  async function deliverNotice(notice: QueuedNotice) {
    if (!notice?.mailId) return;
    try {
      await ctx.mail.deliver(notice.mailId);
    } catch (err) {
      ctx.logger.warn({ err, mailId: notice.mailId }, 'the booking e-mail stays queued');
    }
  }

  async function findLive(tx: Tx, actor: Member, id: string, verb: string) {
    const booking = await repo.find(tx, actor.companyId, id, { lock: true });
    if (!booking) throw notFound('Booking');
    if (booking.status === 'cancelled' || booking.status === 'no_access' || booking.status === 'done') {
      const word = booking.status === 'done' ? 'done' : booking.status === 'cancelled' ? 'cancelled' : 'closed for no access';
      throw validationFailed({ _: [`This booking is ${word}; it cannot be ${verb}. Book a new visit instead.`] });
    }
    return booking;
  }

  async function rangeRows(companyId: string, timeZone: string, from: string, to: string, technicianId?: string) {
    const start = instantOfLocalDateTime(timeZone, `${from}T00:00`);
    const endDay = addDays(to, 1);
    const end = instantOfLocalDateTime(timeZone, `${endDay}T00:00`);
    return repo.inWindow(ctx.db, companyId, start, end, technicianId);
  }

  return {
    async create(actor: Member, input: BookingInput & { source: NonNullable<BookingInput['source']> }): Promise<BookingDto> {
      const timeZone = await timeZoneOf(ctx.db, actor.companyId);
      const { startsAt, endsAt } = windowOf(timeZone, input);
      // Another company's appliances answer 404 before anything about the technician is said.
      const found = await repo.appliancesOf(ctx.db, actor.companyId, input.applianceIds);
      if (found.length !== input.applianceIds.length) throw notFound('Appliance');
      await technicianFor(ctx.db, actor, input.technicianId);
      const siteIds = new Set(found.map((a) => a.siteId));
      if (siteIds.size > 1) throw validationFailed({ applianceIds: ['All the appliances in one booking must be at one site.'] });
      const row = await guarded(timeZone, input.technicianId, startsAt, endsAt, undefined, async (tx) => {
        if (input.serviceRequestId && !(await repo.claimServiceRequest(tx, actor.companyId, input.serviceRequestId, actor.userId))) throw notFound('Service request');
        const booking = await repo.insert(
          tx,
          {
            companyId: actor.companyId,
            siteId: found[0].siteId,
            technicianId: input.technicianId,
            startsAt,
            endsAt,
            source: input.serviceRequestId ? 'service_request' : input.source,
            serviceRequestId: input.serviceRequestId ?? null,
            note: input.note || null,
            createdBy: actor.userId,
            updatedBy: actor.userId,
          },
          input.applianceIds,
        );
        await recordChange(tx, actor, booking, 'booked', timeZone, { source: booking.source });
        return { booking, notice: await queueBookingNotice(ctx, tx, booking.id, 'booked') };
      });
      await deliverNotice(row.notice);
      return one(ctx.db, actor.companyId, row.booking);
    },

    async get(actor: Member, id: string): Promise<BookingDto> {
      const row = await repo.find(ctx.db, actor.companyId, id);
      if (!row) throw notFound('Booking');
      return one(ctx.db, actor.companyId, row);
    },

    async move(actor: Member, id: string, input: BookingMoveInput): Promise<BookingDto> {
      const timeZone = await timeZoneOf(ctx.db, actor.companyId);
      const { startsAt, endsAt } = windowOf(timeZone, input);
      if (input.technicianId) await technicianFor(ctx.db, actor, input.technicianId);
      const existing = await repo.find(ctx.db, actor.companyId, id);
      if (!existing) throw notFound('Booking');
      const technicianId = input.technicianId ?? existing.technicianId;
      const row = await guarded(timeZone, technicianId, startsAt, endsAt, id, async (tx) => {
        const before = await findLive(tx, actor, id, 'moved');
        const moved = await repo.update(tx, actor.companyId, id, {
          startsAt,
          endsAt,
          technicianId,
          ...(input.note !== undefined ? { note: input.note || null } : {}),
          updatedBy: actor.userId,
        });
        await recordChange(tx, actor, moved, 'moved', timeZone, {
          from: { startsAt: before.startsAt.toISOString(), endsAt: before.endsAt.toISOString(), technicianId: before.technicianId },
        });
        return { moved, notice: await queueBookingNotice(ctx, tx, id, 'moved', { before }) };
      });
      await deliverNotice(row.notice);
      return one(ctx.db, actor.companyId, row.moved);
    },

    async confirm(actor: Member, id: string): Promise<BookingDto> {
      const timeZone = await timeZoneOf(ctx.db, actor.companyId);
      const row = await ctx.db.transaction(async (tx) => {
        const before = await findLive(tx, actor, id, 'confirmed');
        if (before.status === 'confirmed') return before;
        const row = await repo.update(tx, actor.companyId, id, { status: 'confirmed', updatedBy: actor.userId });
        await recordChange(tx, actor, row, 'confirmed', timeZone);
        return row;
      });
      return one(ctx.db, actor.companyId, row);
    },

    async close(actor: Member, id: string, status: 'cancelled' | 'no_access', reason: string): Promise<BookingDto> {
      const timeZone = await timeZoneOf(ctx.db, actor.companyId);
      const row = await ctx.db.transaction(async (tx) => {
        const before = await findLive(tx, actor, id, status === 'cancelled' ? 'cancelled' : 'closed');
        if (status === 'no_access' && !isOffice(actor) && before.technicianId !== actor.userId)
          throw forbidden('Only the booked technician or the office can record no access.');
        const row = await repo.update(tx, actor.companyId, id, { status, statusReason: reason, updatedBy: actor.userId });
        await recordChange(tx, actor, row, status, timeZone, { reason });
        // No access is the technician's record of a visit that happened; only a cancellation owes the homeowner an e-mail.
        return { row, notice: status === 'cancelled' ? await queueBookingNotice(ctx, tx, id, 'cancelled') : null };
      });
      await deliverNotice(row.notice);
      return one(ctx.db, actor.companyId, row.row);
    },

    async list(actor: Member, q: { from: string; to: string; technicianId?: string }): Promise<BookingListDto> {
      const timeZone = await timeZoneOf(ctx.db, actor.companyId);
      const rows = await rangeRows(actor.companyId, timeZone, q.from, q.to, q.technicianId);
      const [{ list }, technicians] = await Promise.all([dtos(ctx.db, actor.companyId, rows, timeZone, q.to), repo.technicians(ctx.db, actor.companyId)]);
      return { from: q.from, to: q.to, timeZone, technicians, bookings: list };
    },

    async loadList(actor: Member, q: { from: string; to: string; technicianId?: string }): Promise<LoadListDto> {
      const timeZone = await timeZoneOf(ctx.db, actor.companyId);
      const rows = await rangeRows(actor.companyId, timeZone, q.from, q.to, q.technicianId);
      const { details } = await dtos(ctx.db, actor.companyId, rows, timeZone, q.to);
      return loadList(rows, details, { from: q.from, to: q.to, technicianId: q.technicianId ?? null });
    },

    async round(actor: Member, q: { date: string; technicianId?: string }): Promise<RoundDto> {
      const technicianId = q.technicianId ?? actor.userId;
      const tech = await repo.activeTechnician(ctx.db, actor.companyId, technicianId);
      if (!tech) throw notFound('Technician');
      const timeZone = await timeZoneOf(ctx.db, actor.companyId);
      const rows = await rangeRows(actor.companyId, timeZone, q.date, q.date, technicianId);
      const { list, details } = await dtos(ctx.db, actor.companyId, rows, timeZone, q.date);
      return {
        date: q.date,
        timeZone,
        technician: { id: tech.id, name: tech.name },
        bookings: list,
        loadList: loadList(rows, details, { from: q.date, to: q.date, technicianId }),
      };
    },
  };
}

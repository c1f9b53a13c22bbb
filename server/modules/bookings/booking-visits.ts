import { and, eq, sql } from 'drizzle-orm';
import type { Tx } from '../../db/client';
import { bookingAppliances, bookings } from '../../db/schema/index';
import { validationFailed } from '../../lib/http-error';
import { recordAudit } from '../../core/audit-log';
import { appendTimelineEvent } from '../../core/timeline';
import { bookingsRepository } from './bookings.repository';

/** A visit may be started from a live booking of this company that covers the appliance; anything else is a 400 on bookingId. */
export async function assertBookingCovers(tx: Tx, companyId: string, bookingId: string, applianceId: string) {
  const [row] = await tx
    .select({ status: bookings.status })
    .from(bookings)
    .innerJoin(bookingAppliances, eq(bookingAppliances.bookingId, bookings.id))
    .where(and(eq(bookings.companyId, companyId), eq(bookings.id, bookingId), eq(bookingAppliances.applianceId, applianceId)));
  if (!row) throw validationFailed({ bookingId: ['This booking does not cover this appliance.'] });
  if (row.status === 'cancelled' || row.status === 'no_access') throw validationFailed({ bookingId: ['This booking was closed; start the visit without it or book again.'] });
}

/** Once every appliance of the booking has a completed visit from it, the booking is done (in the completion's transaction). */
export async function markBookingDoneIfVisited(tx: Tx, companyId: string, bookingId: string, actorId: string) {
  const result = await tx.execute<{ open: number }>(sql`
    select count(*)::int as open from booking_appliances ba
    where ba.booking_id = ${bookingId}
      and not exists (select 1 from visits v where v.booking_id = ba.booking_id and v.appliance_id = ba.appliance_id and v.status = 'completed')`);
  if (result.rows[0].open > 0) return;
  const done = await bookingsRepository.markDone(tx, companyId, bookingId, actorId);
  if (!done) return;
  const applianceIds = (await bookingsRepository.applianceIdsOf(tx, bookingId)).map((r) => r.applianceId);
  for (const applianceId of applianceIds) {
    await appendTimelineEvent(tx, { companyId, applianceId, occurredAt: new Date(), kind: 'booking', refId: bookingId, summary: 'Booked visit done', data: { change: 'done' }, actorId });
  }
  await recordAudit(tx, { companyId, actorId, action: 'done', entity: 'booking', entityId: bookingId, changes: { status: 'done' } });
}

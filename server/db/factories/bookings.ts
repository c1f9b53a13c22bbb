import type { DbOrTx } from '../client';
import { bookingAppliances, bookings } from '../schema/index';
import { instantOfLocalDateTime } from '../../../shared/dates';

type BookingOverrides = Partial<typeof bookings.$inferInsert> & {
  companyId: string;
  siteId: string;
  technicianId: string;
  applianceIds: string[];
  /** Wall-clock window in `timeZone` (default America/New_York), used when startsAt/endsAt are not given. */
  start?: string;
  end?: string;
  timeZone?: string;
};

/** A booking with its appliances, written straight to the tables (tests and the seed; the API goes through the service). */
export async function insertBooking(db: DbOrTx, overrides: BookingOverrides) {
  const { applianceIds, start, end, timeZone = 'America/New_York', ...fields } = overrides;
  const startsAt = fields.startsAt ?? (start ? instantOfLocalDateTime(timeZone, start) : new Date(Date.now() + 86_400_000));
  const endsAt = fields.endsAt ?? (end ? instantOfLocalDateTime(timeZone, end) : new Date(startsAt.getTime() + 90 * 60_000));
  const [row] = await db.insert(bookings).values({ ...fields, startsAt, endsAt }).returning();
  await db.insert(bookingAppliances).values(applianceIds.map((applianceId) => ({ bookingId: row.id, applianceId, companyId: row.companyId })));
  return row;
}

import { and, asc, eq, gt, inArray, or, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { bookingAppliances, bookings, companies, users } from '../../db/schema/index';
import { localDateTimeOf, todayInTimeZone } from '../../../shared/dates';
import type { NextBookingDto } from '../../../shared/schemas/bookings';

/** The earliest booked or confirmed booking of this appliance that has not ended yet, or started today (a technician running late still starts it). */
export async function nextBookingOf(db: DbOrTx, companyId: string, applianceId: string, now = new Date()): Promise<NextBookingDto | null> {
  const [row] = await db
    .select({
      id: bookings.id,
      status: bookings.status,
      startsAt: bookings.startsAt,
      endsAt: bookings.endsAt,
      technicianId: bookings.technicianId,
      technicianName: users.name,
      timeZone: companies.timeZone,
    })
    .from(bookingAppliances)
    .innerJoin(bookings, eq(bookings.id, bookingAppliances.bookingId))
    .innerJoin(users, eq(users.id, bookings.technicianId))
    .innerJoin(companies, eq(companies.id, bookings.companyId))
    .where(
      and(
        eq(bookingAppliances.companyId, companyId),
        eq(bookingAppliances.applianceId, applianceId),
        inArray(bookings.status, ['booked', 'confirmed']),
        or(
          gt(bookings.endsAt, now),
          sql`(${bookings.startsAt} at time zone ${companies.timeZone})::date = (${now.toISOString()}::timestamptz at time zone ${companies.timeZone})::date`,
        ),
      ),
    )
    .orderBy(asc(bookings.startsAt))
    .limit(1);
  if (!row) return null;
  const start = localDateTimeOf(row.timeZone, row.startsAt);
  return {
    id: row.id,
    status: row.status,
    start,
    end: localDateTimeOf(row.timeZone, row.endsAt),
    startsAt: row.startsAt.toISOString(),
    endsAt: row.endsAt.toISOString(),
    timeZone: row.timeZone,
    technician: { id: row.technicianId, name: row.technicianName },
    isToday: start.slice(0, 10) === todayInTimeZone(row.timeZone, now),
  };
}

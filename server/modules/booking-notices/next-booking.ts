import { and, asc, eq, gt, inArray } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { bookingAppliances, bookings, companies, users } from '../../db/schema/index';
import { localDateTimeOf } from '../../../shared/dates';
import type { NextBookingDto } from '../../../shared/schemas/booking-notices';

/** The homeowner is told who knocks, not more. */
export const firstName = (name: string) => name.trim().split(/\s+/)[0] || name;

/** A booking as the homeowner reads it: the date and window on the company's clocks, the technician's first name only. */
export function homeownerBooking(b: { startsAt: Date; endsAt: Date; status: string }, technicianName: string, timeZone: string): NextBookingDto {
  const start = localDateTimeOf(timeZone, b.startsAt);
  const end = localDateTimeOf(timeZone, b.endsAt);
  return {
    date: start.slice(0, 10),
    from: start.slice(11),
    to: end.slice(11),
    startsAt: b.startsAt.toISOString(),
    endsAt: b.endsAt.toISOString(),
    timeZone,
    technicianFirstName: firstName(technicianName),
    status: b.status === 'confirmed' ? 'confirmed' : 'booked',
  };
}

/** The next booked or confirmed visit covering this appliance that has not ended yet, or null. */
export async function nextBookingOf(db: DbOrTx, companyId: string, applianceId: string, now = new Date()): Promise<NextBookingDto | null> {
  const [row] = await db
    .select({ startsAt: bookings.startsAt, endsAt: bookings.endsAt, status: bookings.status, technicianName: users.name, timeZone: companies.timeZone })
    .from(bookingAppliances)
    .innerJoin(bookings, eq(bookings.id, bookingAppliances.bookingId))
    .innerJoin(users, eq(users.id, bookings.technicianId))
    .innerJoin(companies, eq(companies.id, bookings.companyId))
    .where(
      and(
        eq(bookingAppliances.companyId, companyId),
        eq(bookingAppliances.applianceId, applianceId),
        inArray(bookings.status, ['booked', 'confirmed']),
        gt(bookings.endsAt, now),
      ),
    )
    .orderBy(asc(bookings.startsAt))
    .limit(1);
  return row ? homeownerBooking(row, row.technicianName, row.timeZone) : null;
}

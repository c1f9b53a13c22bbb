import type { DbOrTx } from '../../db/client';
import { nextBookingOf } from '../bookings';
import { localDateTimeOf } from '../../../shared/dates';
import type { HomeownerBookingDto } from '../../../shared/schemas/booking-notices';

/** The homeowner is told who knocks, not more. */
export const firstName = (name: string) => name.trim().split(/\s+/)[0] || name;

/** A booking as the homeowner reads it: the date and window on the company's clocks, the technician's first name only. */
export function homeownerBooking(b: { startsAt: Date; endsAt: Date; status: string }, technicianName: string, timeZone: string): HomeownerBookingDto {
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

/** The appliance's next booked visit (as its life record shows it), told the homeowner's way. */
export async function nextHomeownerBookingOf(db: DbOrTx, companyId: string, applianceId: string, now = new Date()): Promise<HomeownerBookingDto | null> {
  const next = await nextBookingOf(db, companyId, applianceId, now);
  return next && homeownerBooking({ startsAt: new Date(next.startsAt), endsAt: new Date(next.endsAt), status: next.status }, next.technician.name, next.timeZone);
}

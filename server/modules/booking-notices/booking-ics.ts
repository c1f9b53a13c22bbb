import ical, { ICalAttendeeRole, ICalAttendeeStatus, ICalCalendarMethod, ICalEventStatus } from 'ical-generator';
import { getVtimezoneComponent } from '@touch4it/ical-timezones';
import { DateTime } from 'luxon';

export type BookingIcsInput = {
  bookingId: string;
  /** The host part of the UID (RFC 5545, 3.8.4.7: globally unique; the booking's id at our domain). */
  uidDomain: string;
  method: 'REQUEST' | 'CANCEL';
  sequence: number;
  startsAt: Date;
  endsAt: Date;
  timeZone: string;
  summary: string;
  location: string;
  description: string;
  organizer: { name: string; email: string };
  /** The homeowner; RFC 5546 (3.2.2) names the attendees of a REQUEST. No reply is asked for: the e-mail's link is the way to answer. */
  attendee: { name: string; email: string };
  stamp: Date;
};

/** A stable UID per booking, so a move or a cancel updates the one entry in the homeowner's calendar. */
export const bookingUid = (bookingId: string, domain: string) => `booking-${bookingId}@${domain}`;

/**
 * The calendar invitation (RFC 5545 with the iTIP methods of RFC 5546): DTSTART/DTEND carry the company's zone as
 * TZID with its VTIMEZONE, so the visit shows at the right hour across a change of clocks.
 */
export function bookingIcs(input: BookingIcsInput): string {
  const cal = ical({
    prodId: { company: 'Lifeplate', product: 'Bookings', language: 'EN' },
    method: input.method === 'CANCEL' ? ICalCalendarMethod.CANCEL : ICalCalendarMethod.REQUEST,
  });
  // No calendar-wide zone name: DTSTAMP stays in UTC as RFC 5545 (3.8.7.2) requires; the events' zones get a VTIMEZONE.
  cal.timezone({ name: null, generator: getVtimezoneComponent });
  const zoned = (d: Date) => DateTime.fromJSDate(d, { zone: input.timeZone });
  cal.createEvent({
    id: bookingUid(input.bookingId, input.uidDomain),
    sequence: input.sequence,
    stamp: DateTime.fromJSDate(input.stamp, { zone: 'utc' }),
    start: zoned(input.startsAt),
    end: zoned(input.endsAt),
    timezone: input.timeZone,
    summary: input.summary,
    location: input.location,
    description: input.description,
    organizer: input.organizer,
    attendees: [{ ...input.attendee, role: ICalAttendeeRole.REQ, status: ICalAttendeeStatus.ACCEPTED, rsvp: false }],
    status: input.method === 'CANCEL' ? ICalEventStatus.CANCELLED : ICalEventStatus.CONFIRMED,
  });
  return cal.toString();
}

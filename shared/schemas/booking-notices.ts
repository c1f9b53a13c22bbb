/**
 * The homeowner's side of a booking: the e-mails about it (each with a calendar invitation) and the
 * "this time does not suit me" reply, opened from a signed link in those e-mails.
 *
 *   GET  /booking-reply/:token   BookingReplyPageDto        public (404 for a bad token, or a booking that is over or cancelled)
 *   POST /booking-reply/:token   BookingReplyCreatedDto     public (creates a service request about the booking; 429 past the daily limit)
 */
import { z } from 'zod';
import { optionalText, storableText } from './common';
import { NAME_NEEDED_MESSAGE, SERVICE_REQUEST_LIMITS as MAX } from './service-request-limits';

export const BOOKING_NOTICE_KINDS = ['booked', 'moved', 'cancelled', 'day_before'] as const;
export type BookingNoticeKind = (typeof BOOKING_NOTICE_KINDS)[number];
/** What became of one notice: queued in outgoing_mail, or held back (the same two reasons reminders use). */
export type BookingNoticeOutcome = 'sent' | 'opted_out' | 'no_email';

/** `<booking id>.<HMAC-SHA256, base64url>`: the booking is named, the signature makes it unguessable. */
export const bookingReplyTokenParam = z.object({
  token: storableText().regex(/^[0-9a-f-]{36}\.[A-Za-z0-9_-]{43}$/, 'Not a booking link.'),
});

const PHONE_CHARS = /^[0-9+().\-\s/xXet]*$/;
export const bookingReplyInput = z
  .object({
    contactName: storableText(NAME_NEEDED_MESSAGE).trim().min(1, NAME_NEEDED_MESSAGE).max(MAX.contactName, `At most ${MAX.contactName} characters.`),
    contactPhone: optionalText(MAX.contactPhone).refine(
      (v) => !v || (PHONE_CHARS.test(v) && (v.match(/\d/g)?.length ?? 0) >= 7),
      'Give a phone number with at least 7 digits, like 555-0142.',
    ),
    reason: storableText('Tell us why the time does not suit you.')
      .trim()
      .min(1, 'Tell us why the time does not suit you.')
      .max(MAX.message, `At most ${MAX.message} characters.`),
    preferredTimes: storableText('Give a few times that suit you.')
      .trim()
      .min(1, 'Give a few times that suit you, like “weekday mornings after 8”.')
      .max(MAX.preferredTimes, `At most ${MAX.preferredTimes} characters.`),
  });
export type BookingReplyInput = z.input<typeof bookingReplyInput>;

/** The visit as the homeowner sees it: the date and window in the company's zone, the technician's first name only. */
export type HomeownerBookingDto = {
  date: string;
  /** Wall-clock start and end in the company's zone, like "09:00" and "10:30". */
  from: string;
  to: string;
  startsAt: string;
  endsAt: string;
  timeZone: string;
  technicianFirstName: string;
  status: 'booked' | 'confirmed';
};

export type BookingReplyPageDto = {
  company: { name: string; phone: string };
  booking: HomeownerBookingDto & { address: string };
  customerName: string;
};

export type BookingReplyCreatedDto = { id: string; company: { name: string; phone: string } };

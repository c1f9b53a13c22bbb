import type { AppConfig } from '../../config';
import type { DbOrTx } from '../../db/client';
import { COMPANY_MAIL_HEADER } from '../../lib/mailer';
import { LABELS } from '../../../shared/schemas/enums';
import type { BookingNoticeKind, BookingNoticeOutcome } from '../../../shared/schemas/booking-notices';
import type { MailQueue } from '../mail';
import { unsubscribeToken } from '../reminders';
import { bookingIcs } from './booking-ics';
import { bookingNoticeHtml, bookingNoticeSubject, bookingNoticeText } from './booking-notice-mail';
import { bookingNoticesRepository as repo } from './booking-notices.repository';
import { bookingReplyToken } from './booking-reply-token';
import { firstName } from './next-booking';

export type NoticeDeps = { mail: Pick<MailQueue, 'enqueue'>; config: Pick<AppConfig, 'BASE_URL' | 'BETTER_AUTH_SECRET' | 'MAIL_FROM'> };
export type QueuedNotice = { outcome: BookingNoticeOutcome; mailId: string | null } | null;

const addressOf = (mailFrom: string) => mailFrom.match(/<([^>]+)>/)?.[1] ?? mailFrom.trim();
const joinWords = (words: string[]) => (words.length <= 1 ? words.join('') : `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`);

/**
 * Records the homeowner's e-mail about one booking change (or the day-before reminder) and queues it with its
 * calendar invitation, in the caller's transaction: the booking change and its e-mail commit together (an outbox),
 * and the key (booking, kind, revision) makes each go once. Null when this notice was already recorded. A customer
 * who opted out or has no address gets a row saying so and no e-mail, as reminders do. The caller delivers after
 * the commit (`ctx.mail.deliver`); the mail-delivery job retries what the server did not take.
 */
export async function queueBookingNotice(
  deps: NoticeDeps,
  tx: DbOrTx,
  bookingId: string,
  kind: BookingNoticeKind,
  opts: { before?: { startsAt: Date; endsAt: Date } } = {},
): Promise<QueuedNotice> {
  const c = await repo.context(tx, bookingId);
  if (!c) return null;
  const b = c.booking;
  const outcome: BookingNoticeOutcome = c.optedOut ? 'opted_out' : !c.email ? 'no_email' : 'sent';
  const claimed = await repo.claim(tx, {
    bookingId,
    companyId: b.companyId,
    kind,
    revision: b.revision,
    outcome,
    data: { sequence: b.sequence, startsAt: b.startsAt.toISOString(), endsAt: b.endsAt.toISOString(), ...(opts.before ? { before: { startsAt: opts.before.startsAt.toISOString(), endsAt: opts.before.endsAt.toISOString() } } : {}) },
  });
  if (!claimed) return null;
  if (outcome !== 'sent') return { outcome, mailId: null };

  const base = deps.config.BASE_URL;
  const unsubscribe = unsubscribeToken(deps.config.BETTER_AUTH_SECRET, c.customerId);
  const address = `${c.street}, ${c.town}${c.postalCode ? ` ${c.postalCode}` : ''}`;
  const titles = [...new Set(c.appliances.map((a) => LABELS.applianceKind[a.kind].toLowerCase()))];
  const what = titles.length ? `your ${joinWords(titles)}` : 'your heating equipment';
  const words = {
    kind,
    customerName: c.customerName,
    company: { name: c.companyName, phone: c.companyPhone },
    address,
    startsAt: b.startsAt,
    endsAt: b.endsAt,
    timeZone: c.timeZone,
    technicianFirstName: firstName(c.technicianName),
    what,
    burnsGas: c.appliances.some((a) => a.fuel === 'natural_gas' || a.fuel === 'propane'),
    before: opts.before ?? null,
    replyUrl: kind === 'cancelled' ? null : `${base}/booking-reply/${bookingReplyToken(deps.config.BETTER_AUTH_SECRET, bookingId)}`,
    unsubscribeUrl: `${base}/unsubscribe/${unsubscribe}`,
  };
  const ics = bookingIcs({
    bookingId,
    uidDomain: new URL(base).hostname,
    method: kind === 'cancelled' ? 'CANCEL' : 'REQUEST',
    sequence: b.sequence,
    startsAt: b.startsAt,
    endsAt: b.endsAt,
    timeZone: c.timeZone,
    summary: `${c.companyName}: service visit`,
    location: address,
    description: `${c.companyName} looks after ${what}. Call ${c.companyPhone} about this visit.`,
    organizer: { name: c.companyName, email: addressOf(deps.config.MAIL_FROM) },
    attendee: { name: c.customerName, email: c.email! },
    stamp: new Date(),
  });
  const mailId = await deps.mail.enqueue(
    tx,
    {
      to: c.email!,
      subject: bookingNoticeSubject(words),
      text: bookingNoticeText(words),
      html: bookingNoticeHtml(words),
      headers: {
        'List-Unsubscribe': `<${base}/api/unsubscribe/${unsubscribe}>`,
        'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
        [COMPANY_MAIL_HEADER]: b.companyId,
      },
      attachments: [
        {
          filename: kind === 'cancelled' ? 'visit-cancelled.ics' : 'visit.ics',
          contentType: `text/calendar; charset=utf-8; method=${kind === 'cancelled' ? 'CANCEL' : 'REQUEST'}`,
          content: Buffer.from(ics, 'utf8').toString('base64'),
        },
      ],
    },
    { kind: 'booking_notice', companyId: b.companyId, refId: bookingId },
  );
  await repo.setMail(tx, { bookingId, kind, revision: b.revision }, mailId);
  return { outcome, mailId };
}

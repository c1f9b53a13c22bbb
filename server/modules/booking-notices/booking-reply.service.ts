import { and, asc, eq } from 'drizzle-orm';
import type { AppContext } from '../../context';
import { bookingAppliances } from '../../db/schema/index';
import { notFound } from '../../lib/http-error';
import { formatVisitWindow } from '../../../shared/format/dates';
import type { BookingReplyCreatedDto, BookingReplyInput, BookingReplyPageDto } from '../../../shared/schemas/booking-notices';
import { serviceRequestsService } from '../service-requests';
import { verifyBookingReplyToken } from './booking-reply-token';
import { bookingNoticesRepository } from './booking-notices.repository';
import { homeownerBooking } from './next-booking';

/**
 * The "this time does not suit me" page. The signed token names the booking; a token we did not sign, or one for a
 * booking that is cancelled, over or closed, answers 404 and says nothing about the booking.
 */
export function bookingReplyService(ctx: AppContext) {
  async function resolve(token: string) {
    const bookingId = verifyBookingReplyToken(ctx.config.BETTER_AUTH_SECRET, token);
    if (!bookingId) throw notFound('Booking');
    // The same facts the booking's e-mails are written from.
    const row = await bookingNoticesRepository.context(ctx.db, bookingId);
    const live = row && (row.booking.status === 'booked' || row.booking.status === 'confirmed') && row.booking.endsAt > new Date();
    if (!live) throw notFound('Booking');
    return row;
  }

  return {
    async open(token: string): Promise<BookingReplyPageDto> {
      const r = await resolve(token);
      return {
        company: { name: r.companyName, phone: r.companyPhone },
        booking: { ...homeownerBooking(r.booking, r.technicianName, r.timeZone), address: `${r.street}, ${r.town}` },
        customerName: r.customerName,
      };
    },

    /** A service request about the booking, for the office to call back and move it; the booking itself stays as it is. */
    async reply(token: string, input: BookingReplyInput): Promise<BookingReplyCreatedDto> {
      const r = await resolve(token);
      const b = r.booking;
      const [first] = await ctx.db
        .select({ applianceId: bookingAppliances.applianceId })
        .from(bookingAppliances)
        .where(and(eq(bookingAppliances.bookingId, b.id), eq(bookingAppliances.companyId, b.companyId)))
        .orderBy(asc(bookingAppliances.applianceId))
        .limit(1);
      if (!first) throw notFound('Booking');
      const when = formatVisitWindow(b.startsAt, b.endsAt, r.timeZone);
      return serviceRequestsService(ctx).create(
        { companyId: b.companyId, applianceId: first.applianceId, via: 'booking_reply', bookingId: b.id },
        {
          contactName: input.contactName,
          contactPhone: input.contactPhone ?? null,
          contactEmail: r.email,
          preferredTimes: input.preferredTimes,
          message: `The booked time does not suit: ${when}.\nWhy: ${input.reason}`,
        },
      );
    },
  };
}

import { eq } from 'drizzle-orm';
import type { AppContext } from '../../context';
import { companies } from '../../db/schema/index';
import { instantOfLocalDateTime, todayInTimeZone } from '../../../shared/dates';
import { addDays } from '../../../shared/trade/iso-date';
import { bookingNoticesRepository as repo } from './booking-notices.repository';
import { queueBookingNotice } from './queue-booking-notice';

export type DayBeforeResult = { companyId: string; date: string; queued: number; heldBack: number };

/**
 * One reminder per booking and revision for the booked or confirmed visits starting tomorrow on the company's
 * clocks. The notice's key (booking, kind, revision) is the guard: a second run, or a retry, finds the row and
 * sends nothing; a booking moved since gets a reminder for its new revision.
 */
export async function runDayBeforeReminders(ctx: AppContext, companyId: string, now = new Date()): Promise<DayBeforeResult> {
  const [company] = await ctx.db.select({ timeZone: companies.timeZone }).from(companies).where(eq(companies.id, companyId));
  if (!company) return { companyId, date: '', queued: 0, heldBack: 0 };
  const tomorrow = addDays(todayInTimeZone(company.timeZone, now), 1);
  const from = instantOfLocalDateTime(company.timeZone, `${tomorrow}T00:00`);
  const to = instantOfLocalDateTime(company.timeZone, `${addDays(tomorrow, 1)}T00:00`);
  const result = { companyId, date: tomorrow, queued: 0, heldBack: 0 };
  for (const b of await repo.startingBetween(ctx.db, companyId, from, to)) {
    const notice = await ctx.db.transaction(async (tx) => queueBookingNotice(ctx, tx, b.id, 'day_before'));
    if (!notice) continue;
    if (!notice.mailId) {
      result.heldBack += 1;
      continue;
    }
    result.queued += 1;
    // Queued already; a mail server that is away only delays it (the mail-delivery job tries again).
    await ctx.mail.deliver(notice.mailId).catch((err: unknown) => ctx.logger.warn({ err, mailId: notice.mailId }, 'day-before reminder stays queued'));
  }
  return result;
}

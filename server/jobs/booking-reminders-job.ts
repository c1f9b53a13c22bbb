import { z } from 'zod';
import type { AppContext } from '../context';
import { companies } from '../db/schema/index';
import { runDayBeforeReminders } from '../modules/booking-notices';

export const BOOKING_REMINDERS_QUEUE = 'booking-reminders-daily';
/** 22:00 UTC: the afternoon before across North America, in time to clear the boiler room and plan the day. */
export const BOOKING_REMINDERS_CRON = '0 22 * * *';

/** The scheduled job covers every company; a job may name companies to run for only those. */
export const bookingRemindersJobData = z.object({ companyIds: z.array(z.uuid()).optional() }).default({});

export async function bookingRemindersJob(ctx: AppContext, data: unknown) {
  const parsed = bookingRemindersJobData.parse(data ?? {});
  const ids = parsed.companyIds ?? (await ctx.db.select({ id: companies.id }).from(companies)).map((c) => c.id);
  const failed: string[] = [];
  const results = [];
  for (const id of ids) {
    try {
      results.push(await runDayBeforeReminders(ctx, id));
    } catch (err) {
      ctx.logger.warn({ err, companyId: id }, 'day-before reminders failed for a company');
      failed.push(id);
    }
  }
  // Throwing marks the job failed in pg-boss, which retries it; reminders already recorded are not sent again.
  if (failed.length) throw new Error(`day-before reminders failed for ${failed.length} of ${ids.length} companies`);
  return { companies: results.length, queued: results.reduce((n, r) => n + r.queued, 0) };
}

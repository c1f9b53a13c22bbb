import { z } from 'zod';
import type { AppContext } from '../context';
import { companies } from '../db/schema/index';
import { runRemindersForCompanies } from '../modules/reminders';

export const REMINDERS_QUEUE = 'reminders-daily';
/** Once a day at 14:00 UTC (morning across North America); each company's "today" is its own date. */
export const REMINDERS_CRON = '0 14 * * *';

/** The scheduled job has no data and covers every company; a job may name companies to run for only those. */
export const remindersJobData = z.object({ companyIds: z.array(z.uuid()).optional() }).default({});

export async function remindersJob(ctx: AppContext, data: unknown) {
  const parsed = remindersJobData.parse(data ?? {});
  const ids = parsed.companyIds ?? (await ctx.db.select({ id: companies.id }).from(companies)).map((c) => c.id);
  const results = await runRemindersForCompanies(ctx, ids);
  const failed = results.filter((r) => !r.ok).map((r) => r.companyId);
  // Throwing marks the job failed in pg-boss so the failure is visible there; the next daily run retries.
  if (failed.length) throw new Error(`reminder run failed for ${failed.length} of ${results.length} companies`);
  return { companies: results.length };
}

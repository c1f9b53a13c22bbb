import { z } from 'zod';
import type { AppContext } from '../context';

export const MAIL_QUEUE = 'mail-delivery';
/** Every minute: queued mail goes out within a minute of its retry falling due. */
export const MAIL_CRON = '* * * * *';

/** The scheduled job has no data and covers all mail; a job may name companies to send only theirs. */
export const mailJobData = z.object({ companyIds: z.array(z.uuid()).optional() }).default({});

export async function mailJob(ctx: AppContext, data: unknown) {
  const { companyIds } = mailJobData.parse(data ?? {});
  const counts = await ctx.mail.deliverDue({ companyIds });
  if (counts.sent || counts.failed) ctx.logger.info(counts, 'queued e-mail sent');
  return counts;
}

import type { AppContext } from '../context';
import { sweepOrphanObjects } from '../modules/photos';

export const PHOTO_SWEEP_QUEUE = 'photo-orphan-sweep';
/** Every six hours. Objects whose database row never got written (a crash between the two) go a day later. */
export const PHOTO_SWEEP_CRON = '17 */6 * * *';

export async function photoSweepJob(ctx: AppContext) {
  const { deleted } = await sweepOrphanObjects(ctx, { olderThanHours: 24 });
  if (deleted.length) ctx.logger.info({ deleted: deleted.length }, 'removed orphaned photo objects');
  return { deleted: deleted.length };
}

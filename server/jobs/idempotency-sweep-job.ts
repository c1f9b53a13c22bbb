import type { AppContext } from '../context';
import { sweepIdempotencyKeys } from '../lib/idempotency/sweep-idempotency-keys';

export const IDEMPOTENCY_SWEEP_QUEUE = 'idempotency-key-sweep';
/** Hourly, so no key outlives its TTL by more than an hour. */
export const IDEMPOTENCY_SWEEP_CRON = '41 * * * *';

export async function idempotencySweepJob(ctx: AppContext) {
  const { deleted } = await sweepIdempotencyKeys(ctx.db);
  if (deleted) ctx.logger.info({ deleted }, 'removed expired idempotency keys');
  return { deleted };
}

import type { Db } from '../../db/client';
import { idempotencyRepository } from './idempotency.repository';

/**
 * How long a key is kept. The phone replays its outbox within hours; a day covers a shift spent out of signal. The
 * draft leaves the expiry to the server and asks that it be documented (DEVELOPERS.md, "Idempotency keys").
 */
export const IDEMPOTENCY_KEY_TTL_HOURS = 24;

/** Deletes keys older than the TTL, done or left in progress by a request that never finished (a crash). */
export async function sweepIdempotencyKeys(db: Db, now = new Date()) {
  const before = new Date(now.getTime() - IDEMPOTENCY_KEY_TTL_HOURS * 3600_000);
  return { deleted: await idempotencyRepository.deleteOlderThan(db, before) };
}

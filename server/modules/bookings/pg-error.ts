/** A PostgreSQL SQLSTATE, looked for through Drizzle's wrapping `cause`. */
function hasSqlState(err: unknown, code: string, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 3) return false;
  const e = err as { code?: unknown; cause?: unknown };
  return e.code === code || hasSqlState(e.cause, code, depth + 1);
}

/** 23P01 exclusion_violation: the booking overlaps another of the technician's. */
export const isExclusionViolation = (err: unknown) => hasSqlState(err, '23P01');

/**
 * 40P01 deadlock_detected. Two clashing inserts checked by the exclusion constraint at the same moment can each wait
 * for the other's transaction, and PostgreSQL's deadlock detector cancels one (seen as a 500 in a racing test). Run
 * again, it meets the committed row and gets 23P01.
 */
export const isDeadlock = (err: unknown) => hasSqlState(err, '40P01');

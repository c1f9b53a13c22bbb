/** PostgreSQL's SQLSTATE 23P01 (exclusion_violation), looked for through Drizzle's wrapping `cause`. */
export function isExclusionViolation(err: unknown, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 3) return false;
  const e = err as { code?: unknown; cause?: unknown };
  return e.code === '23P01' || isExclusionViolation(e.cause, depth + 1);
}

/** WEB_CONCURRENCY as a whole number of HTTP workers, 1 to 32 (unset: 1); anything else is a configuration error. */
export function webConcurrency(value: string | undefined): number {
  if (value === undefined || value.trim() === '') return 1;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1 || n > 32) throw new Error(`WEB_CONCURRENCY must be a whole number from 1 to 32 (got "${value}").`);
  return n;
}

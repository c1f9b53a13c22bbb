/** Tries before a message is given up on: with the delays below, about sixteen hours of a mail server away. */
export const MAIL_MAX_ATTEMPTS = 15;
/** A claimed try still unfinished after this long (the process died mid-send) is taken up again. */
export const MAIL_LEASE_SECONDS = 5 * 60;

const FIRST_DELAY_SECONDS = 60;
const LONGEST_DELAY_SECONDS = 2 * 3600;

/** Exponential backoff, doubling from a minute up to two hours: the wait after the given number of failed tries. */
// common practice: capped exponential backoff (no jitter needed: one sweep per minute already spreads the load)
export function mailRetryDelaySeconds(failedTries: number): number {
  return Math.min(FIRST_DELAY_SECONDS * 2 ** Math.max(0, failedTries - 1), LONGEST_DELAY_SECONDS);
}

/** An SMTP 5xx answer is permanent (RFC 5321, 4.2.1): trying the same message again cannot succeed. */
export function isPermanentSmtpFailure(err: unknown): boolean {
  const code = (err as { responseCode?: unknown } | null)?.responseCode;
  return typeof code === 'number' && code >= 500 && code < 600;
}

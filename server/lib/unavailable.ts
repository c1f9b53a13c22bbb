/**
 * Tells a passing outage of a service the app depends on (PostgreSQL restarting, object storage down) from a bug.
 * Such a failure answers 503 with Retry-After, which the phone's draft sync and the client's retry wait out;
 * anything else stays a 500.
 */

export type UnavailableService = 'database' | 'storage';

/** Seconds a client should wait before trying again; a restart of PostgreSQL takes a few. */
export const RETRY_AFTER_SECONDS = 5;

// Socket-level failures, whichever service they came from.
const NETWORK_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ECONNABORTED', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENETUNREACH', 'ENOTFOUND', 'EAI_AGAIN']);

// SQLSTATE (PostgreSQL manual, appendix A "PostgreSQL Error Codes"): class 08 connection exception;
// 57P01 admin_shutdown, 57P02 crash_shutdown, 57P03 cannot_connect_now; 53300 too_many_connections.
const PG_UNAVAILABLE_STATES = new Set(['57P01', '57P02', '57P03', '53300']);

// node-postgres and pg-pool say these in words only (no code).
const PG_CONNECTION_MESSAGES = [
  'Connection terminated unexpectedly',
  'Connection terminated due to connection timeout',
  'timeout exceeded when trying to connect',
  'Client has encountered a connection error and is not queryable',
  'Client was closed and is not queryable',
];

type ErrorLike = {
  code?: unknown;
  message?: unknown;
  name?: unknown;
  cause?: unknown;
  errors?: unknown;
  $metadata?: { httpStatusCode?: number };
  $fault?: unknown;
};

/** Which service is out, or null when the error is not an outage. Looks through `cause` (Drizzle wraps) and AggregateError. */
export function unavailableService(err: unknown, depth = 0): UnavailableService | null {
  if (!err || typeof err !== 'object' || depth > 5) return null;
  const e = err as ErrorLike;
  const code = typeof e.code === 'string' ? e.code : '';
  const message = typeof e.message === 'string' ? e.message : '';

  if (e.$metadata) {
    // An error from the AWS SDK: the storage answered 5xx, or could not be reached (no HTTP status at all).
    const status = e.$metadata.httpStatusCode;
    if ((status !== undefined && status >= 500) || (status === undefined && (NETWORK_CODES.has(code) || e.name === 'TimeoutError'))) return 'storage';
    return null;
  }
  if (PG_UNAVAILABLE_STATES.has(code) || /^08[0-9A-Z]{3}$/.test(code)) return 'database';
  if (PG_CONNECTION_MESSAGES.some((m) => message.includes(m))) return 'database';

  const inner = unavailableService(e.cause, depth + 1) ?? (Array.isArray(e.errors) ? firstOf(e.errors, depth) : null);
  if (inner) return inner;
  // A bare socket error comes from node-postgres (the S3 SDK adds $metadata to its own, above).
  if (NETWORK_CODES.has(code)) return 'database';
  return null;
}

function firstOf(errors: unknown[], depth: number): UnavailableService | null {
  for (const inner of errors) {
    const found = unavailableService(inner, depth + 1);
    if (found) return found;
  }
  return null;
}

export const unavailableMessage = (service: UnavailableService) =>
  service === 'database'
    ? 'The database cannot be reached just now. Try again in a few seconds.'
    : 'Photo storage cannot be reached just now. Try again in a few seconds.';

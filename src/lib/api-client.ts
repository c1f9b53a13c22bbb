import type { ErrorBody, FieldErrors, FileRejection } from '@shared/schemas/errors';
import { noteNoSignal, noteServerReached } from './network-state';

export type { FieldErrors } from '@shared/schemas/errors';

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: FieldErrors,
    /** From a 503's Retry-After: how long the server asked us to wait before trying again. */
    readonly retryAfterMs?: number,
    /** Refused uploads, each with its file name and reason. */
    readonly files?: FileRejection[],
  ) {
    super(message);
  }
  /** A network failure (no signal in a basement), as opposed to the server saying no. */
  get offline() {
    return this.status === 0;
  }
}

type Options = Omit<RequestInit, 'body'> & { body?: unknown; query?: Record<string, string | number | boolean | undefined | null> };

export async function api<T>(path: string, { body, query, headers, ...init }: Options = {}): Promise<T> {
  const qs = query
    ? new URLSearchParams(Object.entries(query).filter(([, v]) => v !== undefined && v !== null && v !== '').map(([k, v]) => [k, String(v)])).toString()
    : '';
  let res: Response;
  try {
    res = await fetch(`/api${path}${qs ? `?${qs}` : ''}`, {
      credentials: 'same-origin',
      ...init,
      headers: { ...(body !== undefined && !(body instanceof FormData) ? { 'Content-Type': 'application/json' } : {}), ...headers },
      body: body === undefined ? undefined : body instanceof FormData ? body : JSON.stringify(body),
    });
  } catch {
    noteNoSignal();
    throw new ApiError(0, 'offline', 'No connection. Your work is kept on this device.');
  }
  noteServerReached();
  if (res.status === 204) return undefined as T;
  const data = await res.json().catch(() => null);
  if (!res.ok) {
    const err: Partial<ErrorBody['error']> | undefined = data?.error ?? data;
    throw new ApiError(res.status, err?.code ?? 'http_error', err?.message ?? `Request failed (${res.status}).`, err?.details, retryAfterMs(res.headers.get('Retry-After')), err?.files);
  }
  return data as T;
}

/** Retry-After in seconds (RFC 9110 §10.2.3 also allows an HTTP date; our server sends seconds). */
export function retryAfterMs(header: string | null): number | undefined {
  if (!header || !/^\d+$/.test(header.trim())) return undefined;
  return Number(header.trim()) * 1000;
}

import { afterEach, describe, expect, it, vi } from 'vitest';
import { api, ApiError, retryAfterMs } from '@/lib/api-client';
import { createQueryClient } from '@/lib/query-client';

afterEach(() => vi.unstubAllGlobals());

const answer = (status: number, body: unknown, headers: Record<string, string> = {}) =>
  vi.stubGlobal('fetch', vi.fn(async () => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json', ...headers } })));

describe('a 503 from the server', () => {
  it('becomes an ApiError carrying the Retry-After wait', async () => {
    answer(503, { error: { code: 'unavailable', message: 'The database cannot be reached just now.' } }, { 'Retry-After': '5' });
    const err = await api('/customers', { method: 'POST', body: {} }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ApiError);
    expect(err).toMatchObject({ status: 503, code: 'unavailable', retryAfterMs: 5000, offline: false });
  });

  it('is retried by queries after the wait the server asked for; a 4xx is not retried', () => {
    const { retry, retryDelay } = createQueryClient().getDefaultOptions().queries!;
    const unavailable = new ApiError(503, 'unavailable', 'down', undefined, 5000);
    const refused = new ApiError(404, 'not_found', 'gone');
    expect(typeof retry === 'function' && retry(0, unavailable)).toBe(true);
    expect(typeof retry === 'function' && retry(0, refused)).toBe(false);
    expect(typeof retryDelay === 'function' && retryDelay(1, unavailable)).toBe(5000);
    // Without Retry-After, TanStack Query's usual doubling backoff.
    expect(typeof retryDelay === 'function' && retryDelay(1, new ApiError(0, 'offline', 'no signal'))).toBe(2000);
  });
});

describe('retryAfterMs', () => {
  // Source: RFC 9110 §10.2.3, Retry-After = HTTP-date / delay-seconds.
  it('reads delay-seconds and ignores what it cannot read', () => {
    expect(retryAfterMs('5')).toBe(5000);
    expect(retryAfterMs(' 120 ')).toBe(120_000);
    expect(retryAfterMs(null)).toBeUndefined();
    expect(retryAfterMs('soon')).toBeUndefined();
    expect(retryAfterMs('Wed, 21 Oct 2015 07:28:00 GMT')).toBeUndefined();
  });
});

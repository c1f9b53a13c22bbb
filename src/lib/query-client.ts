import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';

export function createQueryClient() {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // A 4xx will not change by asking again; no signal, a 5xx or a 503 (the server's database restarting) may.
        retry: (count, error) => !(error instanceof ApiError && error.status >= 400 && error.status < 500) && count < 2,
        // A 503 says how long to wait; otherwise TanStack Query's own backoff (1 s, 2 s, 4 s…, at most 30 s).
        retryDelay: (count, error) => (error instanceof ApiError && error.retryAfterMs) || Math.min(1000 * 2 ** count, 30_000),
      },
    },
  });
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import { ApiError, api } from '@/lib/api-client';
import type { OutboxMessageDto } from '@shared/schemas/reminders';

export const getOutbox = (limit: number) => api<OutboxMessageDto[]>('/dev/outbox', { query: { limit } });
export const outboxQueryOptions = (limit = 50) => queryOptions({ queryKey: ['dev-outbox', { limit }], queryFn: () => getOutbox(limit) });
export const useOutbox = () => useQuery(outboxQueryOptions());

/** The outbox exists only beside the local SMTP fake; elsewhere the API answers 404 and the link stays hidden. */
export function useOutboxAvailable(enabled: boolean) {
  const probe = useQuery({
    queryKey: ['dev-outbox', 'available'],
    queryFn: async () => {
      try {
        await getOutbox(1);
        return true;
      } catch (err) {
        if (err instanceof ApiError && (err.status === 404 || err.status === 403)) return false;
        throw err;
      }
    },
    enabled,
    staleTime: Infinity,
    retry: false,
  });
  return probe.data === true;
}

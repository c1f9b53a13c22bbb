import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { UnsubscribeStatusDto } from '@shared/schemas/reminders';

const path = (token: string) => `/unsubscribe/${encodeURIComponent(token)}`;

export const getUnsubscribeStatus = (token: string) => api<UnsubscribeStatusDto>(path(token));
export const unsubscribeStatusQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['unsubscribe', token], queryFn: () => getUnsubscribeStatus(token), retry: false });
export const useUnsubscribeStatus = (token: string) => useQuery(unsubscribeStatusQueryOptions(token));

export const unsubscribe = (token: string) => api<UnsubscribeStatusDto>(path(token), { method: 'POST' });

export function useUnsubscribe(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => unsubscribe(token),
    onSuccess: (status) => qc.setQueryData(unsubscribeStatusQueryOptions(token).queryKey, status),
  });
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api-client';
import type { HomeownerViewDto } from '@shared/schemas/homeowner';

export const getSharedRecord = (token: string) => api<HomeownerViewDto>(`/share/${encodeURIComponent(token)}`);
export const sharedRecordQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['share', token],
    queryFn: () => getSharedRecord(token),
    retry: (count, err) => !(err instanceof ApiError && err.status < 500) && count < 2,
  });
export const useSharedRecord = (token: string) => useQuery(sharedRecordQueryOptions(token));

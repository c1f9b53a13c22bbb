import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SearchHit } from '@shared/schemas/records';

/** The server asks for at least two characters. */
export const MIN_SEARCH_LENGTH = 2;

export const searchAppliances = (q: string, signal?: AbortSignal) => api<SearchHit[]>('/search', { query: { q }, signal });

export const applianceSearchQueryOptions = (q: string) =>
  queryOptions({
    queryKey: ['search', q],
    queryFn: ({ signal }) => searchAppliances(q, signal),
    enabled: q.length >= MIN_SEARCH_LENGTH,
    placeholderData: keepPreviousData,
    staleTime: 15_000,
  });

export const useApplianceSearch = (q: string) => useQuery(applianceSearchQueryOptions(q));

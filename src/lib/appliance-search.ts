/** Appliance search, used by more than one feature (find, tag assignment), so it lives here once. */
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SearchHit } from '@shared/schemas/records';

/** The server asks for at least two characters (searchQuery in shared/schemas/records.ts). */
export const MIN_SEARCH_LENGTH = 2;

export const searchAppliances = (q: string, signal?: AbortSignal) => api<SearchHit[]>('/search', { query: { q }, signal });

export const searchQueryOptions = (q: string) =>
  queryOptions({
    queryKey: ['search', q],
    queryFn: ({ signal }) => searchAppliances(q, signal),
    enabled: q.length >= MIN_SEARCH_LENGTH,
    placeholderData: keepPreviousData,
    staleTime: 15_000,
  });

export const useSearch = (q: string) => useQuery(searchQueryOptions(q));

import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { VisitDto } from '@shared/schemas/visits';

export const getVisit = (id: string) => api<VisitDto>(`/visits/${id}`);

export const visitQueryOptions = (id: string) =>
  queryOptions({
    queryKey: ['visit', id],
    queryFn: () => getVisit(id),
    // The draft engine owns a draft's state once loaded; refetching behind it would only race its saves.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });

export const useVisit = (id: string) => useQuery(visitQueryOptions(id));

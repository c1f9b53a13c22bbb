import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { VisitDto } from '@shared/schemas/visits';

import { locallyStartedVisit } from './visit-outbox';

/** A visit started with no signal is answered from the outbox until the server has it (it would say 404 till then). */
export const getVisit = async (id: string) => locallyStartedVisit(id) ?? api<VisitDto>(`/visits/${id}`);

export const visitQueryOptions = (id: string) =>
  queryOptions({
    queryKey: ['visit', id],
    queryFn: () => getVisit(id),
    // The draft engine owns a draft's state once loaded; refetching behind it would only race its saves.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });

export const useVisit = (id: string) => useQuery(visitQueryOptions(id));

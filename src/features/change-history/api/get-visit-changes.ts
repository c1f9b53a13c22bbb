import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { applianceKeys } from '@/lib/resources/appliances';
import type { ChangesPageDto } from '@shared/schemas/changes';

const PAGE_SIZE = 20;

export const getVisitChanges = (visitId: string, cursor: string | undefined) =>
  api<ChangesPageDto>(`/visits/${encodeURIComponent(visitId)}/changes`, { query: { limit: PAGE_SIZE, cursor } });

/** Keyed under the visit's appliance, so the amendment's invalidation of the record refreshes it too. */
export const visitChangesQueryOptions = (applianceId: string, visitId: string, enabled = true) =>
  infiniteQueryOptions({
    queryKey: applianceKeys.visitChanges(applianceId, visitId),
    queryFn: ({ pageParam }) => getVisitChanges(visitId, pageParam),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    enabled,
  });

export const useVisitChanges = (applianceId: string, visitId: string, enabled: boolean) => useInfiniteQuery(visitChangesQueryOptions(applianceId, visitId, enabled));

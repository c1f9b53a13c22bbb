import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { applianceKeys } from '@/lib/resources/appliances';
import type { ChangesPageDto } from '@shared/schemas/changes';

const PAGE_SIZE = 20;

export const getApplianceChanges = (id: string, cursor: string | undefined) =>
  api<ChangesPageDto>(`/appliances/${encodeURIComponent(id)}/changes`, { query: { limit: PAGE_SIZE, cursor } });

export const applianceChangesQueryOptions = (id: string, enabled = true) =>
  infiniteQueryOptions({
    queryKey: applianceKeys.changes(id),
    queryFn: ({ pageParam }) => getApplianceChanges(id, pageParam),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    enabled,
  });

export const useApplianceChanges = (id: string, enabled: boolean) => useInfiniteQuery(applianceChangesQueryOptions(id, enabled));

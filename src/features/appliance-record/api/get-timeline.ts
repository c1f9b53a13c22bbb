import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Page, TimelineEventDto } from '@shared/schemas/records';
import type { TimelineKind } from '@shared/schemas/enums';
import { applianceKeys } from '@/lib/resources/appliances';

const PAGE_SIZE = 20;

export const getTimeline = (id: string, kind: TimelineKind | undefined, before: string | undefined) =>
  api<Page<TimelineEventDto>>(`/appliances/${id}/timeline`, { query: { kind, before, limit: PAGE_SIZE } });

export const timelineQueryOptions = (id: string, kind?: TimelineKind) =>
  infiniteQueryOptions({
    queryKey: applianceKeys.timeline(id, kind ?? 'all'),
    queryFn: ({ pageParam }) => getTimeline(id, kind, pageParam),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
  });

export const useTimeline = (id: string, kind?: TimelineKind) => useInfiniteQuery(timelineQueryOptions(id, kind));

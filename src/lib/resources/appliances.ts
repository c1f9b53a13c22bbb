import { infiniteQueryOptions, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ApplianceRecordDto, Page, TimelineEventDto } from '@shared/schemas/records';
import type { TimelineKind } from '@shared/schemas/enums';

/**
 * `/appliances/:id` and everything shown under one appliance. Every key starts with `applianceKeys.all`, so
 * invalidating `record(id)` refreshes the record with its photos, timeline and links, and `all` every open record.
 */
export const applianceKeys = {
  all: ['appliance'] as const,
  record: (id: string) => ['appliance', id] as const,
  timeline: (id: string, kind?: string) => (kind === undefined ? (['appliance', id, 'timeline'] as const) : (['appliance', id, 'timeline', kind] as const)),
  photos: (id: string) => ['appliance', id, 'photos'] as const,
  shareLinks: (id: string) => ['appliance', id, 'share-links'] as const,
  recordTransfers: (id: string) => ['appliance', id, 'record-transfers'] as const,
  makeupWater: (id: string) => ['appliance', id, 'makeup-water'] as const,
  /** The history of changes (audit trail) of the record, and of one of its visits: an amendment refreshes both. */
  changes: (id: string) => ['appliance', id, 'changes'] as const,
  visitChanges: (id: string, visitId: string) => ['appliance', id, 'visit-changes', visitId] as const,
};

export const getApplianceRecord = (id: string) => api<ApplianceRecordDto>(`/appliances/${encodeURIComponent(id)}`);
export const applianceRecordQueryOptions = (id: string) => queryOptions({ queryKey: applianceKeys.record(id), queryFn: () => getApplianceRecord(id) });
export const useApplianceRecord = (id: string) => useQuery(applianceRecordQueryOptions(id));

const TIMELINE_PAGE_SIZE = 20;

export const getTimeline = (id: string, kind: TimelineKind | undefined, before: string | undefined) =>
  api<Page<TimelineEventDto>>(`/appliances/${id}/timeline`, { query: { kind, before, limit: TIMELINE_PAGE_SIZE } });

/** The record's history, newest first; the round saves its first page for offline use. */
export const timelineQueryOptions = (id: string, kind?: TimelineKind) =>
  infiniteQueryOptions({
    queryKey: applianceKeys.timeline(id, kind ?? 'all'),
    queryFn: ({ pageParam }) => getTimeline(id, kind, pageParam),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
  });

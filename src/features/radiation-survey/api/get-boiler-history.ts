import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Page, TimelineEventDto } from '@shared/schemas/records';
import { radiationSurveyKeys } from './keys';

/** The old boiler's visits and part swaps for the proposal: the latest hundred of each, newest first. */
export async function getBoilerHistory(applianceId: string): Promise<TimelineEventDto[]> {
  const path = `/appliances/${encodeURIComponent(applianceId)}/timeline`;
  const [visits, swaps] = await Promise.all([
    api<Page<TimelineEventDto>>(path, { query: { kind: 'visit', limit: 100 } }),
    api<Page<TimelineEventDto>>(path, { query: { kind: 'part_swap', limit: 100 } }),
  ]);
  return [...visits.items, ...swaps.items].sort((a, b) => b.occurredAt.localeCompare(a.occurredAt));
}
export const boilerHistoryQueryOptions = (applianceId: string) =>
  queryOptions({ queryKey: radiationSurveyKeys.history(applianceId), queryFn: () => getBoilerHistory(applianceId) });
export const useBoilerHistory = (applianceId: string) => useQuery(boilerHistoryQueryOptions(applianceId));

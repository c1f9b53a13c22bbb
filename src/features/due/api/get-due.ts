import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Page } from '@shared/schemas/records';
import type { DueItemDto } from '@shared/schemas/due';

export type DueFilters = { withinDays: number; type?: string; applianceKind?: string; technicianId?: string; town?: string; after?: string; limit?: number };

export const getDue = (query: DueFilters) => api<Page<DueItemDto>>('/due', { query });
export const dueQueryOptions = (query: DueFilters) =>
  queryOptions({ queryKey: ['due', query], queryFn: () => getDue(query), placeholderData: keepPreviousData });
export const useDue = (query: DueFilters) => useQuery(dueQueryOptions(query));

import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DueStockDto } from '@shared/schemas/due';

export const getDueStock = (withinDays: number) => api<DueStockDto>('/due/stock', { query: { withinDays } });
export const dueStockQueryOptions = (withinDays: number) => queryOptions({ queryKey: ['due', 'stock', withinDays], queryFn: () => getDueStock(withinDays) });
export const useDueStock = (withinDays: number) => useQuery(dueStockQueryOptions(withinDays));

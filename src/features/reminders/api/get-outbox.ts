import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { OutboxMessageDto } from '@shared/schemas/reminders';

export const getOutbox = (limit: number) => api<OutboxMessageDto[]>('/dev/outbox', { query: { limit } });
export const outboxQueryOptions = (limit = 50) => queryOptions({ queryKey: ['dev-outbox', { limit }], queryFn: () => getOutbox(limit) });
export const useOutbox = () => useQuery(outboxQueryOptions());

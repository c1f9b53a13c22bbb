import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RemindersPageDto } from '@shared/schemas/reminders';

export const getReminders = (limit: number) => api<RemindersPageDto>('/reminders', { query: { limit } });
export const remindersQueryOptions = (limit = 50) => queryOptions({ queryKey: ['reminders', { limit }], queryFn: () => getReminders(limit) });
export const useReminders = (limit = 50) => useQuery(remindersQueryOptions(limit));

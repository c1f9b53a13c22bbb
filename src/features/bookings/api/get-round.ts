import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { RoundDto } from '@shared/schemas/bookings';

export const bookingKeys = {
  all: ['bookings'] as const,
  round: (date: string, technicianId?: string) => [...bookingKeys.all, 'round', { date, technicianId }] as const,
  board: (from: string, to: string) => [...bookingKeys.all, 'board', { from, to }] as const,
  unbooked: (query: object) => [...bookingKeys.all, 'unbooked', query] as const,
};

export const getRound = (date: string, technicianId?: string) => api<RoundDto>('/rounds', { query: { date, ...(technicianId ? { technicianId } : {}) } });
export const roundQueryOptions = (date: string, technicianId?: string) =>
  queryOptions({ queryKey: bookingKeys.round(date, technicianId), queryFn: () => getRound(date, technicianId) });
export const useRound = (date: string, technicianId?: string) => useQuery(roundQueryOptions(date, technicianId));

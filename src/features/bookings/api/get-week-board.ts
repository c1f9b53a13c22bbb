import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BookingListDto } from '@shared/schemas/bookings';
import { bookingKeys } from './get-round';

export const getWeekBoard = (from: string, to: string) => api<BookingListDto>('/bookings', { query: { from, to } });
export const weekBoardQueryOptions = (from: string, to: string) => queryOptions({ queryKey: bookingKeys.board(from, to), queryFn: () => getWeekBoard(from, to) });
export const useWeekBoard = (from: string, to: string) => useQuery(weekBoardQueryOptions(from, to));

import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api-client';
import type { BookingReplyPageDto } from '@shared/schemas/booking-notices';

export const bookingReplyPath = (token: string) => `/booking-reply/${encodeURIComponent(token)}`;

export const getBookingReply = (token: string) => api<BookingReplyPageDto>(bookingReplyPath(token));
export const bookingReplyQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['booking-reply', token],
    queryFn: () => getBookingReply(token),
    retry: (count, err) => !(err instanceof ApiError && err.status < 500) && count < 2,
  });
export const useBookingReply = (token: string) => useQuery(bookingReplyQueryOptions(token));

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BookingDto, BookingInput } from '@shared/schemas/bookings';
import { bookingKeys } from './get-round';

export const createBooking = (input: BookingInput) => api<BookingDto>('/bookings', { method: 'POST', body: input });
export function useCreateBooking() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createBooking, onSuccess: () => qc.invalidateQueries({ queryKey: bookingKeys.all }) });
}

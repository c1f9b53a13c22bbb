import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BookingDto, BookingInput } from '@shared/schemas/bookings';
import { applianceKeys } from '@/lib/resources/appliances';
import { bookingKeys } from './get-round';

export const createBooking = (input: BookingInput) => api<BookingDto>('/bookings', { method: 'POST', body: input });
export function useCreateBooking() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createBooking,
    // The booked appliances' records show their next booking.
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: bookingKeys.all }), qc.invalidateQueries({ queryKey: applianceKeys.all })]),
  });
}

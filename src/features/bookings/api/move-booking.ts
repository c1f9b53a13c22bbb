import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BookingDto, BookingMoveInput } from '@shared/schemas/bookings';
import { bookingKeys } from './get-round';

export const moveBooking = (id: string, input: BookingMoveInput) => api<BookingDto>(`/bookings/${id}/move`, { method: 'POST', body: input });
export function useMoveBooking() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: string; input: BookingMoveInput }) => moveBooking(id, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: bookingKeys.all }),
  });
}

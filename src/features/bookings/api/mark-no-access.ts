import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BookingDto, BookingReasonInput } from '@shared/schemas/bookings';
import { bookingKeys } from './get-round';

export const markNoAccess = ({ bookingId, ...body }: BookingReasonInput & { bookingId: string }) =>
  api<BookingDto>(`/bookings/${bookingId}/no-access`, { method: 'POST', body });

export function useMarkNoAccess() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: markNoAccess, onSuccess: () => qc.invalidateQueries({ queryKey: bookingKeys.all }) });
}

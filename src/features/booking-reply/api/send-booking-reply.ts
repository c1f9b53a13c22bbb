import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BookingReplyCreatedDto, BookingReplyInput } from '@shared/schemas/booking-notices';
import { bookingReplyPath } from './get-booking-reply';

// Types only from the schema file: zod stays out of the homeowner's bundle; the server validates and names each field.
export const sendBookingReply = (token: string, input: BookingReplyInput) =>
  api<BookingReplyCreatedDto>(bookingReplyPath(token), { method: 'POST', body: input });

export const useSendBookingReply = (token: string) => useMutation({ mutationFn: (input: BookingReplyInput) => sendBookingReply(token, input) });

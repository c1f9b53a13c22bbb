import type { BookingSource } from '@shared/schemas/bookings';

/** Where a "Book" action leads: the booking page with the appliances (all at one site) and where the work was found. */
export function bookingHref(opts: { applianceIds: string[]; source: BookingSource; serviceRequestId?: string }): string {
  const q = new URLSearchParams();
  for (const id of opts.applianceIds) q.append('appliance', id);
  q.set('source', opts.source);
  if (opts.serviceRequestId) q.set('serviceRequest', opts.serviceRequestId);
  return `/book?${q.toString()}`;
}

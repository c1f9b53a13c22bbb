import type { NextBookingDto } from '@shared/schemas/bookings';
import { formatCalendarDate } from '@shared/format/dates';

const clock = (local: string) => local.slice(11, 16);

/** "Today, 09:00–10:30 with Sam": the window in the company's wall-clock time. */
export function bookingWindowWords(b: NextBookingDto): string {
  return `${b.isToday ? 'Today' : formatCalendarDate(b.start.slice(0, 10))}, ${clock(b.start)}–${clock(b.end)} with ${b.technician.name}`;
}

// The public face of the booking-notices module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { runDayBeforeReminders } from './day-before-reminders';
export { nextHomeownerBookingOf } from './next-booking';
export { queueBookingNotice } from './queue-booking-notice';
export type { NoticeDeps, QueuedNotice } from './queue-booking-notice';

import { bookingNoticesRepository } from './booking-notices.repository';

export const unannouncedBookings = (...args: Parameters<typeof bookingNoticesRepository.unannounced>) => bookingNoticesRepository.unannounced(...args);

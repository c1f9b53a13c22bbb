// The public face of the bookings module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { assertBookingCovers, markBookingDoneIfVisited } from './booking-visits';
export { nextBookingOf } from './next-booking';

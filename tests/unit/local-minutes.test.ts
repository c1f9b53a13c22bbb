import { describe, expect, it } from 'vitest';
import { addMinutesToLocal, localMinutesBetween } from '../../shared/schemas/bookings';

// Wall-clock arithmetic on ISO 8601 local date-times (no zone): common practice, checked against the calendar.
describe('wall-clock minutes', () => {
  it('adds minutes across midnight, a month end and a leap day', () => {
    expect(addMinutesToLocal('2026-12-08T09:00', 90)).toBe('2026-12-08T10:30');
    expect(addMinutesToLocal('2026-12-31T23:30', 60)).toBe('2027-01-01T00:30');
    // Source: ISO 8601 / the Gregorian calendar: 2028 is a leap year, so 28 Feb is followed by 29 Feb.
    expect(addMinutesToLocal('2028-02-28T23:00', 120)).toBe('2028-02-29T01:00');
  });

  it('is the inverse of localMinutesBetween', () => {
    expect(localMinutesBetween('2026-12-08T09:00', addMinutesToLocal('2026-12-08T09:00', 135))).toBe(135);
    expect(localMinutesBetween('2026-12-31T23:30', '2027-01-01T00:30')).toBe(60);
  });
});

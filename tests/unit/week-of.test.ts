import { describe, expect, it } from 'vitest';
import { mondayOf } from '../../shared/trade/iso-date';
import { formatWeekday } from '../../shared/format/dates';

describe('the week board’s week', () => {
  it('starts on the Monday of the week, Sunday belonging to the week before', () => {
    // Source: ISO 8601-1:2019, 3.2.2 (the week begins on Monday); 2026-11-18 is a Wednesday, as any 2026 calendar shows.
    expect(mondayOf('2026-11-18')).toBe('2026-11-16');
    expect(mondayOf('2026-11-16')).toBe('2026-11-16');
    expect(mondayOf('2026-11-22')).toBe('2026-11-16');
    // Across a month and a year: 2027-01-01 is a Friday; its week began Monday 2026-12-28.
    expect(mondayOf('2027-01-01')).toBe('2026-12-28');
  });

  it('names a day by weekday and date', () => {
    expect(formatWeekday('2026-11-23')).toBe('Mon, Nov 23');
    expect(formatWeekday('2026-11-28')).toBe('Sat, Nov 28');
  });
});

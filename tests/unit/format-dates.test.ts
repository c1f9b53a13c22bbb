import { describe, expect, it, vi, beforeAll, afterAll } from 'vitest';
import { daysFromToday, formatCalendarDate, formatDueDate, formatInstant, relativeDays } from '../../shared/format/dates';
import { formatBtuh } from '../../shared/format/quantities';
import { todayInTimeZone } from '../../shared/dates';

// A fixed clock: 2 Dec 2026, 20:00 UTC (3 p.m. in New York, UTC−5 in winter).
// Source: 15 U.S.C. 260a: daylight time ends on the first Sunday of November, so New York is on UTC−5 in December.
beforeAll(() => {
  vi.useFakeTimers({ toFake: ['Date'], now: new Date('2026-12-02T20:00:00Z') });
});
afterAll(() => {
  vi.useRealTimers();
});

describe('formatCalendarDate', () => {
  it('shows a calendar date as written, whatever the reader’s zone', () => {
    expect(formatCalendarDate('2027-01-06')).toBe('Jan 6, 2027');
    expect(formatCalendarDate('2027-01-06', { long: true })).toBe('January 6, 2027');
    expect(formatCalendarDate('2027-01-06T00:00:00.000Z')).toBe('Jan 6, 2027');
    expect(formatCalendarDate(null)).toBe('—');
  });
  it('never returns an ISO string', () => {
    expect(formatCalendarDate('2027-01-06')).not.toMatch(/\d{4}-\d{2}-\d{2}/);
  });
});

describe('formatInstant', () => {
  it('reads an instant on the company’s clocks', () => {
    const now = new Date();
    expect(formatInstant(now, 'America/New_York')).toBe('Dec 2, 2026, 3:00 PM');
    expect(formatInstant(now.toISOString(), 'Europe/Berlin')).toBe('Dec 2, 2026, 9:00 PM');
    // 20:00 UTC is already the next day in Tokyo (UTC+9).
    expect(formatInstant(now, 'Asia/Tokyo')).toBe('Dec 3, 2026, 5:00 AM');
  });
});

describe('relative days', () => {
  // Read inside each test: the describe body runs while files are collected, before beforeAll fixes the clock.
  const companyToday = () => todayInTimeZone('America/New_York');
  it('counts whole calendar days from the company’s today', () => {
    const today = companyToday();
    expect(today).toBe('2026-12-02');
    expect(daysFromToday('2027-01-06', today)).toBe(35);
    expect(daysFromToday('2026-11-30', today)).toBe(-2);
  });
  it('speaks in words where they help', () => {
    const today = companyToday();
    expect(relativeDays('2026-12-02', today)).toBe('today');
    expect(relativeDays('2026-12-03', today)).toBe('tomorrow');
    expect(relativeDays('2026-11-29', today)).toBe('3 days ago');
    expect(formatDueDate('2027-01-06', today)).toBe('Jan 6, 2027 · in 35 days');
  });
});

describe('formatBtuh', () => {
  it('rounds to the whole Btu/h with thousands grouped', () => {
    // Source: CLDR number patterns for en-US (#,##0), as Intl.NumberFormat applies them.
    expect(formatBtuh(175_000)).toBe('175,000 Btu/h');
    expect(formatBtuh(42_549.4)).toBe('42,549 Btu/h');
  });
});

import { describe, expect, it } from 'vitest';
import { instantInTimeZone, todayInTimeZone } from '../../shared/dates';

describe('todayInTimeZone', () => {
  // 03:30 UTC on 2 March is still 1 March in New York (UTC−5 in winter) and already 2 March in Berlin.
  const instant = new Date('2026-03-02T03:30:00Z');
  it('gives the calendar date where the company works', () => {
    expect(todayInTimeZone('America/New_York', instant)).toBe('2026-03-01');
    expect(todayInTimeZone('Europe/Berlin', instant)).toBe('2026-03-02');
    expect(todayInTimeZone('UTC', instant)).toBe('2026-03-02');
  });
});

// Source: 15 U.S.C. 260a (as amended by the Energy Policy Act of 2005): daylight time begins at 2:00 a.m. on the
// second Sunday of March and ends at 2:00 a.m. on the first Sunday of November; in 2026 those are 8 March and
// 1 November. New York keeps UTC−5 in winter and UTC−4 in daylight time.
describe('instantInTimeZone', () => {
  const ny = 'America/New_York';
  it('reads the wall clock in the zone, winter and summer', () => {
    expect(instantInTimeZone(ny, '2026-01-15', 0, 30).toISOString()).toBe('2026-01-15T05:30:00.000Z');
    expect(instantInTimeZone(ny, '2026-07-15', 23, 30).toISOString()).toBe('2026-07-16T03:30:00.000Z');
    expect(instantInTimeZone('America/Chicago', '2026-07-15', 12).toISOString()).toBe('2026-07-15T17:00:00.000Z');
    expect(instantInTimeZone('UTC', '2026-07-15', 12).toISOString()).toBe('2026-07-15T12:00:00.000Z');
  });

  it('on the spring-forward day: before, inside and after the skipped hour', () => {
    expect(instantInTimeZone(ny, '2026-03-08', 1, 30).toISOString()).toBe('2026-03-08T06:30:00.000Z');
    // 02:30 never shows on the clocks that night; it reads as 03:30 daylight time.
    expect(instantInTimeZone(ny, '2026-03-08', 2, 30).toISOString()).toBe('2026-03-08T07:30:00.000Z');
    expect(instantInTimeZone(ny, '2026-03-08', 3, 30).toISOString()).toBe('2026-03-08T07:30:00.000Z');
    expect(instantInTimeZone(ny, '2026-03-08', 12).toISOString()).toBe('2026-03-08T16:00:00.000Z');
  });

  it('on the fall-back day: the repeated hour gives its first pass', () => {
    expect(instantInTimeZone(ny, '2026-11-01', 0, 30).toISOString()).toBe('2026-11-01T04:30:00.000Z');
    expect(instantInTimeZone(ny, '2026-11-01', 1, 30).toISOString()).toBe('2026-11-01T05:30:00.000Z');
    expect(instantInTimeZone(ny, '2026-11-01', 2, 30).toISOString()).toBe('2026-11-01T07:30:00.000Z');
    expect(instantInTimeZone(ny, '2026-11-01', 12).toISOString()).toBe('2026-11-01T17:00:00.000Z');
  });

  it('round-trips with todayInTimeZone at either end of the day', () => {
    for (const date of ['2026-03-08', '2026-06-30', '2026-11-01', '2026-12-31']) {
      expect(todayInTimeZone(ny, instantInTimeZone(ny, date, 0, 0))).toBe(date);
      expect(todayInTimeZone(ny, instantInTimeZone(ny, date, 23, 59))).toBe(date);
    }
  });
});

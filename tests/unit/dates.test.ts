import { describe, expect, it } from 'vitest';
import { todayInTimeZone } from '../../shared/dates';

describe('todayInTimeZone', () => {
  // 03:30 UTC on 2 March is still 1 March in New York (UTC−5 in winter) and already 2 March in Berlin.
  const instant = new Date('2026-03-02T03:30:00Z');
  it('gives the calendar date where the company works', () => {
    expect(todayInTimeZone('America/New_York', instant)).toBe('2026-03-01');
    expect(todayInTimeZone('Europe/Berlin', instant)).toBe('2026-03-02');
    expect(todayInTimeZone('UTC', instant)).toBe('2026-03-02');
  });
});

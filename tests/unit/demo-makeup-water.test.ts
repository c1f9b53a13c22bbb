import { describe, expect, it } from 'vitest';
import { planMakeupWaterLog, seasonStart } from '../../server/db/seed/demo-makeup-water';
import { addDays } from '../../shared/trade/iso-date';
import { analyzeMakeupWater } from '../../shared/trade/makeup-water';

const codes = (lastRead: string, leak: boolean, variant: number) => {
  const log = planMakeupWaterLog({ lastRead, leak, variant, startGallons: 400 });
  const analysis = analyzeMakeupWater(log.map((e) => ({ date: e.recordedOn, kind: 'meter_reading' as const, gallons: e.gallons! })));
  return { log, analysis, flags: analysis.flags.map((f) => f.code) };
};

// Every morning of two years, so the demo looks the same whenever it is seeded.
const DAYS = Array.from({ length: 731 }, (_, i) => addDays('2025-06-01', i));

describe('demo makeup-water logs', () => {
  it('start on the latest October 1 at least 13 weeks back and read the meter every week up to the last reading', () => {
    expect(seasonStart('2026-01-15')).toBe('2025-10-01');
    expect(seasonStart('2026-12-03')).toBe('2025-10-01');
    expect(seasonStart('2026-12-31')).toBe('2026-10-01');
    const { log } = codes('2026-12-03', false, 0);
    expect(log.at(-1)!.recordedOn).toBe('2026-12-03');
    expect(log[0].recordedOn >= '2025-10-01' && log[0].recordedOn < '2025-10-08').toBe(true);
    for (let i = 1; i < log.length; i++) expect(addDays(log[i - 1].recordedOn, 7)).toBe(log[i].recordedOn);
    // Out of season (June to September) the idle boiler's meter stands still. from memory: NYC Housing Maintenance Code § 27-2029
    const summer = log.filter((e) => e.recordedOn >= '2026-06-08' && e.recordedOn <= '2026-09-30');
    expect(new Set(summer.map((e) => e.gallons)).size).toBe(1);
  });

  it.each([0, 1, 2, 3, 4, 5, 6, 7])('a normal boiler (variant %i) never trips a leak flag and has a small steady rate', (variant) => {
    for (const day of DAYS) {
      const { flags, analysis } = codes(day, false, variant);
      // Fills about every five weeks of firing: not more often than about once a month. common practice (trade-sources.md)
      expect(flags, day).not.toContain('water_added_more_than_monthly');
      expect(flags, day).not.toContain('sharp_rise');
      expect(analysis.gallonsPerWeek!, day).toBeGreaterThan(0);
      expect(analysis.gallonsPerWeek!, day).toBeLessThan(1);
    }
  });

  it('the leaking boiler trips the sharp-rise flag (company default: 2 × the earlier median and 1 gal above it) whenever seeded', () => {
    for (const day of DAYS) {
      const { flags, analysis } = codes(day, true, 0);
      // "Look for a new leak" (shared/trade/makeup-water.ts); the frequent-fill warning may come too, after a summer it need not.
      expect(flags, day).toContain('sharp_rise');
      expect(analysis.latest30DayGallons!, day).toBeGreaterThanOrEqual(2 * analysis.previous30DayMedianGallons!);
    }
  });
});

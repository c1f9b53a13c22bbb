import { describe, expect, it } from 'vitest';
import { fakerFor } from '../../server/db/factories/faker';
import { demoClock } from '../../server/db/seed/demo-clock';
import { visitTimes } from '../../server/db/seed/demo-history';

const NY = 'America/New_York';

describe('demo visit times', () => {
  it('a visit planned for today has ended by now, or took place yesterday', () => {
    const clock = demoClock(new Date('2026-01-15T10:00:00-05:00'), NY);
    const days = new Set<string>();
    for (let seed = 1; seed <= 200; seed++) {
      const v = visitTimes(fakerFor(seed), clock, clock.today);
      expect(v.departedAt.getTime()).toBeLessThanOrEqual(clock.now.getTime());
      expect(v.arrivedAt.getTime()).toBeLessThan(v.departedAt.getTime());
      expect(['2026-01-14', '2026-01-15']).toContain(v.visitedOn);
      days.add(v.visitedOn);
    }
    // At 10:00 some visits (arriving from 08:00) are over and others are not: both branches ran.
    expect([...days].sort()).toEqual(['2026-01-14', '2026-01-15']);
  });

  // 2026-03-08 and 2025-11-02 are days the clocks changed (second Sunday of March, first Sunday of November).
  it('keeps the planned day late in the evening and on earlier days, arriving 08:00 to 14:00 company time', () => {
    const evening = demoClock(new Date('2026-07-15T23:30:00-04:00'), NY);
    for (let seed = 1; seed <= 50; seed++) {
      for (const plannedOn of ['2026-07-15', '2026-03-08', '2025-11-02']) {
        const v = visitTimes(fakerFor(seed), evening, plannedOn);
        expect(v.visitedOn).toBe(plannedOn);
        const hour = Number(new Intl.DateTimeFormat('en-US', { timeZone: NY, hour: 'numeric', hourCycle: 'h23' }).format(v.arrivedAt));
        expect(hour).toBeGreaterThanOrEqual(8);
        expect(hour).toBeLessThanOrEqual(14);
      }
    }
  });
});

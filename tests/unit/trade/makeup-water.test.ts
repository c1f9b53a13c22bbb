import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { analyzeMakeupWater, type MakeupWaterEntry } from '../../../shared/trade/makeup-water';
import { addDays } from '../../../shared/trade/iso-date';
import { TradeInputError } from '../../../shared/trade/trade-input-error';

const codes = (entries: MakeupWaterEntry[]) => analyzeMakeupWater(entries).flags.map((f) => f.code);

describe('a quiet log', () => {
  // Meter read on the 1st of every month of 2024 and on 2025-01-01; 2 gal went in each quarter.
  const readings: Array<[string, number]> = [
    ['2024-01-01', 100], ['2024-02-01', 100], ['2024-03-01', 100], ['2024-04-01', 102], ['2024-05-01', 102],
    ['2024-06-01', 102], ['2024-07-01', 104], ['2024-08-01', 104], ['2024-09-01', 104], ['2024-10-01', 106],
    ['2024-11-01', 106], ['2024-12-01', 106], ['2025-01-01', 108],
  ];
  const log: MakeupWaterEntry[] = readings.map(([date, gallons]) => ({ date, kind: 'meter_reading', gallons }));
  const result = analyzeMakeupWater(log);

  it('raises no flags', () => {
    // common practice: about once a month or less is not a leak sign; the quarterly top-up is steady, not a rise
    expect(result.flags).toEqual([]);
  });

  it('computes the rates over the log span', () => {
    expect(result.spanDays).toBe(366);
    expect(result.totalGallons).toBeCloseTo(8, 9);
    expect(result.gallonsPerWeek).toBeCloseTo((8 / 366) * 7, 9);
    expect(result.gallonsPerMonth).toBeCloseTo((8 / 366) * (365.25 / 12), 9);
    expect(result.fillEvents).toBe(4);
    expect(result.meanDaysBetweenFills).toBeCloseTo((366 - 91) / 3, 9);
  });

  it('gives a monthly series that adds up to the total', () => {
    expect(result.monthly.map((m) => m.month)).toEqual([
      '2024-01', '2024-02', '2024-03', '2024-04', '2024-05', '2024-06', '2024-07',
      '2024-08', '2024-09', '2024-10', '2024-11', '2024-12', '2025-01',
    ]);
    expect(result.monthly[0].daysCovered).toBe(30); // the first day is the baseline
    expect(result.monthly.reduce((sum, m) => sum + m.gallons, 0)).toBeCloseTo(8, 9);
  });
});

describe('water added more than monthly', () => {
  it('weekly hand fills are flagged', () => {
    // common practice: a boiler that needs water more often than about once a month should be checked for leaks
    const log: MakeupWaterEntry[] = Array.from({ length: 10 }, (_, week) => ({
      date: addDays('2024-10-01', week * 7),
      kind: 'added_by_hand' as const,
      gallons: 3,
    }));
    const result = analyzeMakeupWater(log);
    const flag = result.flags.find((f) => f.code === 'water_added_more_than_monthly');
    expect(flag).toMatchObject({ severity: 'warning', value: 7, threshold: 30, source: 'common practice' });
    expect(result.gallonsPerWeek).toBeCloseTo(3, 9); // the first fill is the baseline: 9 × 3 gal over 63 days
  });

  it('weekly meter readings that each show water going in are flagged too', () => {
    const log: MakeupWaterEntry[] = Array.from({ length: 8 }, (_, week) => ({
      date: addDays('2024-11-04', week * 7),
      kind: 'meter_reading' as const,
      gallons: 500 + week,
    }));
    expect(codes(log)).toContain('water_added_more_than_monthly');
  });

  it('two quick fills long ago followed by quiet months are not', () => {
    const log: MakeupWaterEntry[] = [
      { date: '2024-01-01', kind: 'added_by_hand', gallons: 2 },
      { date: '2024-01-06', kind: 'added_by_hand', gallons: 2 },
      { date: '2024-07-01', kind: 'meter_reading', gallons: 0 },
    ];
    expect(codes(log)).not.toContain('water_added_more_than_monthly');
  });
});

describe('sharp rise', () => {
  // 5 gal every 35 days for a year, then 10 gal only 10 days after the last fill.
  const steady: MakeupWaterEntry[] = Array.from({ length: 12 }, (_, i) => ({
    date: addDays('2024-01-01', i * 35),
    kind: 'added_by_hand' as const,
    gallons: 5,
  }));
  const withRise: MakeupWaterEntry[] = [...steady, { date: addDays('2024-01-01', 395), kind: 'added_by_hand', gallons: 10 }];

  it('is flagged when the latest 30 days reach twice the earlier median', () => {
    // company default (common practice): latest 30 days ≥ 2 × median of earlier 30-day periods
    const result = analyzeMakeupWater(withRise);
    // latest 30 days: 20 days of the previous fill (5 gal / 35 d) + the 10 gal fill = 12.86 gal; earlier: 30 × 5/35 = 4.29 gal
    expect(result.latest30DayGallons).toBeCloseTo(10 + (20 * 5) / 35, 6);
    expect(result.previous30DayMedianGallons).toBeCloseTo((30 * 5) / 35, 6);
    const flag = result.flags.find((f) => f.code === 'sharp_rise');
    expect(flag).toMatchObject({ severity: 'warning', unit: 'gal per 30 days' });
    expect(flag!.threshold).toBeCloseTo((2 * 30 * 5) / 35, 6);
    expect(flag!.source).toMatch(/company default/);
    expect(result.flags.map((f) => f.code)).not.toContain('water_added_more_than_monthly');
  });

  it('is not flagged for the steady part alone', () => {
    expect(codes(steady)).toEqual([]);
  });

  it('needs at least two earlier 30-day periods', () => {
    const short: MakeupWaterEntry[] = [
      { date: '2024-01-01', kind: 'meter_reading', gallons: 0 },
      { date: '2024-02-10', kind: 'meter_reading', gallons: 1 },
      { date: '2024-02-20', kind: 'meter_reading', gallons: 30 },
    ];
    const result = analyzeMakeupWater(short);
    expect(result.previous30DayMedianGallons).toBeNull();
    expect(result.flags.map((f) => f.code)).not.toContain('sharp_rise');
  });
});

describe('input', () => {
  it('notes fills with no amount and treats the totals as lower bounds', () => {
    const result = analyzeMakeupWater([
      { date: '2024-01-01', kind: 'added_by_hand', gallons: 1 },
      { date: '2024-03-01', kind: 'added_by_hand' },
      { date: '2024-05-01', kind: 'added_by_hand', gallons: 2 },
    ]);
    expect(result.fillEventsWithUnknownAmount).toBe(1);
    expect(result.totalGallons).toBeCloseTo(2, 9);
    expect(result.flags.map((f) => f.code)).toContain('fill_amounts_unknown');
  });

  it('sorts entries by date', () => {
    const result = analyzeMakeupWater([
      { date: '2024-03-01', kind: 'meter_reading', gallons: 12 },
      { date: '2024-01-01', kind: 'meter_reading', gallons: 10 },
    ]);
    expect(result.firstDate).toBe('2024-01-01');
    expect(result.totalGallons).toBeCloseTo(2, 9);
  });

  it.each([
    [[], 'entries'],
    [[{ date: '2024-13-01', kind: 'meter_reading', gallons: 1 }], 'entries[0].date'],
    [[{ date: '2024-01-01', kind: 'meter_reading', gallons: -1 }], 'entries[0].gallons'],
    [[{ date: '2024-01-01', kind: 'leak', gallons: 1 }], 'entries[0].kind'],
    [
      [
        { date: '2024-01-01', kind: 'meter_reading', gallons: 50 },
        { date: '2024-02-01', kind: 'meter_reading', gallons: 40 },
      ],
      'entries[1].gallons',
    ],
  ])('rejects %j on %s', (entries, field) => {
    try {
      analyzeMakeupWater(entries as MakeupWaterEntry[]);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(TradeInputError);
      expect((error as TradeInputError).field).toBe(field);
    }
  });
});

describe('properties', () => {
  it('for a meter-only log, the total is the last reading minus the first (less first-day water), and the months add up to it', () => {
    const log = fc
      .array(fc.record({ gapDays: fc.integer({ min: 0, max: 60 }), added: fc.integer({ min: 0, max: 20 }) }), { minLength: 1, maxLength: 30 })
      .map((steps) => {
        let day = 0;
        let gallons = 1000;
        let onFirstDay = 0; // water logged on the first day is the baseline and is left out
        const entries: MakeupWaterEntry[] = [{ date: '2023-06-15', kind: 'meter_reading', gallons }];
        for (const step of steps) {
          day += step.gapDays;
          gallons += step.added;
          if (day === 0) onFirstDay += step.added;
          entries.push({ date: addDays('2023-06-15', day), kind: 'meter_reading', gallons });
        }
        return { entries, counted: gallons - 1000 - onFirstDay };
      });
    fc.assert(
      fc.property(log, ({ entries, counted }) => {
        const result = analyzeMakeupWater(entries);
        expect(result.totalGallons).toBeCloseTo(counted, 6);
        expect(result.monthly.reduce((sum, m) => sum + m.gallons, 0)).toBeCloseTo(result.totalGallons, 6);
      }),
    );
  });
});

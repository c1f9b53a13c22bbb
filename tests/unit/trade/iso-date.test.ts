import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { addDays, addMonths, addYears, daysBetween, isoDateToDayNumber } from '../../../shared/trade/iso-date';
import { TradeInputError } from '../../../shared/trade/trade-input-error';

describe('iso-date', () => {
  it('clamps to the end of a shorter month (Gregorian calendar)', () => {
    expect(addMonths('2024-01-31', 1)).toBe('2024-02-29');
    expect(addMonths('2023-01-31', 1)).toBe('2023-02-28');
    expect(addMonths('2024-03-31', -1)).toBe('2024-02-29');
    expect(addYears('2020-02-29', 5)).toBe('2025-02-28');
    expect(addYears('2020-02-29', 4)).toBe('2024-02-29');
    expect(addMonths('2024-11-15', 14)).toBe('2026-01-15');
  });

  it('is not moved by daylight-saving changes', () => {
    // US clocks changed on 2024-03-10 and 2024-11-03; EU on 2024-03-31
    expect(daysBetween('2024-03-09', '2024-03-11')).toBe(2);
    expect(daysBetween('2024-11-02', '2024-11-04')).toBe(2);
    expect(addDays('2024-03-30', 2)).toBe('2024-04-01');
  });

  it('rejects dates that do not exist or are not yyyy-mm-dd', () => {
    for (const bad of ['2023-02-29', '2024-04-31', '2024-1-05', '2024-01-05T00:00:00Z', '', '20240105']) {
      expect(() => isoDateToDayNumber('d', bad)).toThrow(TradeInputError);
    }
  });

  it('addDays and daysBetween are inverses', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 60_000 }), fc.integer({ min: -20_000, max: 20_000 }), (start, n) => {
        const from = addDays('1900-01-01', start);
        expect(daysBetween(from, addDays(from, n))).toBe(n);
      }),
    );
  });

  it('addMonths lands in the right month, never past its end', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 60_000 }), fc.integer({ min: -600, max: 600 }), (start, months) => {
        const from = addDays('1900-01-01', start);
        const to = addMonths(from, months);
        const [fy, fm] = from.split('-').map(Number);
        const [ty, tm, td] = to.split('-').map(Number);
        expect(ty * 12 + tm - (fy * 12 + fm)).toBe(months);
        expect(td).toBeLessThanOrEqual(Number(from.slice(8)));
      }),
    );
  });
});

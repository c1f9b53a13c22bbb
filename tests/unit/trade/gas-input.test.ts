import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  altitudeDeratePct,
  altitudeDerateNote,
  OVER_FIRING_TOLERANCE_PCT,
  clockGasInput,
  compareInputToRating,
  DEFAULT_HEATING_VALUE_BTU_PER_FT3,
} from '../../../shared/trade/gas-input';
import { TradeInputError } from '../../../shared/trade/trade-input-error';

describe('clockGasInput', () => {
  it.each([
    [0.5, 29, 1000, 62_069],
    [1, 15.1, 1050, 250_331],
    [1, 80, 1040, 46_800],
  ])('%s ft³ in %s s at %s Btu/ft³ → %s Btu/h', (dialCubicFeet, secondsPerRevolution, heatingValueBtuPerCubicFoot, published) => {
    // Source: worked meter-clocking examples (reference table, trade-sources): ft³/h = 3600 × dial / seconds
    const { inputBtuPerHour, cubicFeetPerHour } = clockGasInput({ dialCubicFeet, secondsPerRevolution, heatingValueBtuPerCubicFoot });
    expect(Math.abs(inputBtuPerHour - published)).toBeLessThan(1);
    expect(cubicFeetPerHour).toBeCloseTo((3600 * dialCubicFeet) / secondsPerRevolution, 10);
  });

  it('uses the 40 CFR Part 98 heating values by default', () => {
    // Source: 40 CFR Part 98, Subpart C, Table C-1: natural gas 1.026 × 10⁻³ MMBtu/scf, propane 2,516 Btu/ft³
    expect(DEFAULT_HEATING_VALUE_BTU_PER_FT3).toEqual({ natural_gas: 1026, propane: 2516 });
  });

  it.each([
    [{ secondsPerRevolution: 0 }, 'secondsPerRevolution'],
    [{ secondsPerRevolution: -3 }, 'secondsPerRevolution'],
    [{ dialCubicFeet: 0 }, 'dialCubicFeet'],
    [{ dialCubicFeet: -1 }, 'dialCubicFeet'],
    [{ heatingValueBtuPerCubicFoot: Number.NaN }, 'heatingValueBtuPerCubicFoot'],
  ])('rejects %j', (bad, field) => {
    const call = () => clockGasInput({ dialCubicFeet: 1, secondsPerRevolution: 30, heatingValueBtuPerCubicFoot: 1026, ...bad });
    expect(call).toThrow(TradeInputError);
    try {
      call();
    } catch (error) {
      expect((error as TradeInputError).field).toBe(field);
    }
  });

  it('a faster dial always means more input', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 600, noNaN: true }), fc.double({ min: 0.1, max: 100, noNaN: true }), (seconds, faster) => {
        const slow = clockGasInput({ dialCubicFeet: 1, secondsPerRevolution: seconds + faster, heatingValueBtuPerCubicFoot: 1026 });
        const fast = clockGasInput({ dialCubicFeet: 1, secondsPerRevolution: seconds, heatingValueBtuPerCubicFoot: 1026 });
        return fast.inputBtuPerHour > slow.inputBtuPerHour;
      }),
    );
  });
});

describe('compareInputToRating', () => {
  it('an input more than the 2 % clocking tolerance above the rating is over-firing', () => {
    // Source: NFPA 54 (ANSI Z223.1), National Fuel Gas Code, secondary copy of an older edition: over-firing prohibited.
    // common practice (from memory: appliance instructions): a clocked input within 2 % of the rating is within rating.
    expect(OVER_FIRING_TOLERANCE_PCT).toBe(2);
    const within = compareInputToRating({ measuredBtuPerHour: 102_000, ratedBtuPerHour: 100_000, underFiringTolerancePct: 10 });
    expect(within.status).toBe('within_rating');
    const result = compareInputToRating({ measuredBtuPerHour: 102_001, ratedBtuPerHour: 100_000, underFiringTolerancePct: 10 });
    expect(result.status).toBe('over_fired');
    expect(result.deviationPct).toBeCloseTo(2.001, 10);
    expect(result.overFiringTolerancePct).toBe(2);
    expect(result.source).toMatch(/NFPA 54/);
    expect(result.source).toMatch(/common practice/);
  });

  it('explains the step in the derate where it applies: 0 % at 2,000 ft, 8 % at 2,001 ft', () => {
    // Source: NFPA 54, secondary copy of an older edition: 4 % per 1,000 ft above 2,000 ft (counted from sea level,
    // from memory), so 2,001 ft → 8.004 %.
    expect(altitudeDeratePct(2001)).toBeCloseTo(8.004, 10);
    expect(altitudeDerateNote(2001)).toMatch(/derated 8\.0 %/);
    expect(altitudeDerateNote(2001)).toMatch(/0 % at 2,000 ft straight to 8 % at 2,001 ft/);
    expect(altitudeDerateNote(1800)).toMatch(/no derate applies yet/);
    expect(altitudeDerateNote(500)).toBeNull();
    expect(() => altitudeDerateNote(Number.NaN)).toThrow(TradeInputError);
    expect(() => altitudeDerateNote(20_000)).toThrow(TradeInputError);
  });

  it('over-firing is judged against the derated rating, with the same tolerance', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2001, max: 10_000 }), fc.double({ min: -20, max: 20, noNaN: true }), (ft, pct) => {
        const allowed = 100_000 * (1 - altitudeDeratePct(ft) / 100);
        const r = compareInputToRating({ measuredBtuPerHour: allowed * (1 + pct / 100), ratedBtuPerHour: 100_000, underFiringTolerancePct: 100, elevationFt: ft });
        return r.status === (r.deviationPct > OVER_FIRING_TOLERANCE_PCT ? 'over_fired' : 'within_rating');
      }),
    );
  });

  it('under-firing is judged against the given tolerance', () => {
    const rated = { ratedBtuPerHour: 100_000, underFiringTolerancePct: 10 };
    expect(compareInputToRating({ ...rated, measuredBtuPerHour: 90_000 }).status).toBe('within_rating');
    expect(compareInputToRating({ ...rated, measuredBtuPerHour: 89_999 }).status).toBe('under_fired');
    expect(compareInputToRating({ ...rated, measuredBtuPerHour: 100_000 }).status).toBe('within_rating');
  });

  it('derates 4 % per 1,000 ft of elevation, only above 2,000 ft', () => {
    // Source: NFPA 54, secondary copy of an older edition: above 2,000 ft, derate 4 % per 1,000 ft.
    // from memory: the 1,000 ft steps count from sea level, so 5,000 ft → 20 %.
    expect(altitudeDeratePct(2000)).toBe(0);
    expect(altitudeDeratePct(5000)).toBeCloseTo(20, 10);
    // 100,000 Btu/h appliance at 5,000 ft: 80,000 allowed; 85,000 measured is over-fired
    const high = compareInputToRating({ measuredBtuPerHour: 85_000, ratedBtuPerHour: 100_000, underFiringTolerancePct: 10, elevationFt: 5000 });
    expect(high.allowedBtuPerHour).toBeCloseTo(80_000, 6);
    expect(high.status).toBe('over_fired');
    expect(high.source).toMatch(/derate/);
  });

  it('rejects a zero rating and a negative tolerance', () => {
    expect(() => compareInputToRating({ measuredBtuPerHour: 1, ratedBtuPerHour: 0, underFiringTolerancePct: 5 })).toThrow(TradeInputError);
    expect(() => compareInputToRating({ measuredBtuPerHour: 1, ratedBtuPerHour: 10, underFiringTolerancePct: -5 })).toThrow(TradeInputError);
  });
});

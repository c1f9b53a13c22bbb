import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { assessLowWaterCutoff, CUTOFF_TRIP_POSITIONS, LOW_WATER_CUTOFF_RULE_SOURCE } from '../../../shared/trade/low-water-cutoff';
import { TradeInputError } from '../../../shared/trade/trade-input-error';

describe('assessLowWaterCutoff', () => {
  // from memory: ASME Boiler and Pressure Vessel Code, Section IV, low-water fuel cutoff: the fuel is cut off when the
  // water falls to the lowest visible part of the gauge glass. Source: 13 NCAC 13 .0408 (read): that part is at least
  // 1 in above the lowest permissible water level.
  it('passes only when the burner stopped with water still visible in the glass', () => {
    expect(assessLowWaterCutoff({ burnerStopped: true, trippedWith: 'water_visible' })).toMatchObject({ passed: true, flags: [] });
    expect(LOW_WATER_CUTOFF_RULE_SOURCE).toMatch(/ASME Boiler and Pressure Vessel Code, Section IV/);
    expect(LOW_WATER_CUTOFF_RULE_SOURCE).toMatch(/13 NCAC 13 \.0408/);
  });

  it('a cutoff that tripped with the water out of sight failed: a stop', () => {
    const r = assessLowWaterCutoff({ burnerStopped: true, trippedWith: 'below_visible' });
    expect(r).toMatchObject({ passed: false, trippedWith: 'below_visible', flags: [{ code: 'low_water_cutoff_tripped_too_low', severity: 'stop' }] });
    expect(r!.flags[0].message).toMatch(/Do not add water to a hot boiler/);
  });

  it('a burner that kept firing failed, wherever the water was', () => {
    for (const trippedWith of [...CUTOFF_TRIP_POSITIONS, null, undefined]) {
      expect(assessLowWaterCutoff({ burnerStopped: false, trippedWith })).toMatchObject({ passed: false, flags: [{ code: 'low_water_cutoff_failed', severity: 'stop' }] });
    }
  });

  it('is not judged while the trip level against the glass is missing', () => {
    expect(assessLowWaterCutoff({ burnerStopped: true })).toBeNull();
  });

  it('every judged test that failed raises exactly one stop flag, and a pass raises none', () => {
    fc.assert(
      fc.property(fc.boolean(), fc.constantFrom(...CUTOFF_TRIP_POSITIONS, null), (burnerStopped, trippedWith) => {
        const r = assessLowWaterCutoff({ burnerStopped, trippedWith });
        if (r === null) return burnerStopped && trippedWith === null;
        return r.passed ? r.flags.length === 0 : r.flags.length === 1 && r.flags[0].severity === 'stop';
      }),
    );
  });

  it('refuses what is not a test result', () => {
    expect(() => assessLowWaterCutoff({ burnerStopped: 'yes' as never })).toThrow(TradeInputError);
    expect(() => assessLowWaterCutoff({ burnerStopped: true, trippedWith: 'half' as never })).toThrow(TradeInputError);
  });
});

import { describe, expect, it } from 'vitest';
import { computeReadingResults, isOutcomeRequired, refusalsOf, storedResults, type ResultFacts } from '../../../shared/visits/visit-results';

const boiler: ResultFacts = { fuel: 'natural_gas', ventType: 'draft_hood', construction: 'cast_iron', inputBtuh: 100_000, underFiringTolerancePct: null };
const codes = (r: ReturnType<typeof computeReadingResults>) => r.flags.map((f) => f.code);
// Source: the clocking formula ft³/h = 3600 × dial / seconds (trade training, secondary); NFPA 54 prohibits over-firing.
const clocked = (secondsPerRevolution: number) => ({ gasInput: { dialCubicFeet: 1, secondsPerRevolution, heatingValueBtuPerCubicFoot: 1000 } });

describe('computeReadingResults: the one rule for flags and outcomes', () => {
  it('flags over-firing against the nameplate: 1 ft³ in 30 s at 1,000 Btu/ft³ is 120,000 Btu/h, 20 % over 100,000', () => {
    const r = computeReadingResults(clocked(30), boiler);
    expect(r.gasInput?.ok && r.gasInput.value.inputBtuPerHour).toBeCloseTo(120_000, 6);
    expect(r.gasInput?.ok && r.gasInput.value.rating?.status).toBe('over_fired');
    expect(codes(r)).toEqual(['gas_input_over_fired']);
    expect(r.outcomeRequired).toBe(false);
  });

  it('judges under-firing only with a company tolerance (80,000 Btu/h is 20 % under)', () => {
    expect(codes(computeReadingResults(clocked(45), boiler))).toEqual([]);
    const flagged = computeReadingResults(clocked(45), { ...boiler, underFiringTolerancePct: 10 });
    expect(flagged.flags).toMatchObject([{ code: 'gas_input_under_fired', severity: 'info', threshold: 90_000, source: 'company policy' }]);
  });

  it('does not compare without a nameplate rating', () => {
    const r = computeReadingResults(clocked(30), { ...boiler, inputBtuh: null });
    expect(r.gasInput?.ok && r.gasInput.value.rating).toBeUndefined();
    expect(r.flags).toEqual([]);
  });

  it('raises a stop when the burner did not stop on the low-water cutoff test, and requires an outcome', () => {
    // common practice: a low-water cutoff that does not stop the burner has failed its test
    const r = computeReadingResults({ lowWaterCutoff: { type: 'float', burnerStopped: false } }, boiler);
    expect(r.flags).toMatchObject([{ code: 'low_water_cutoff_failed', severity: 'stop' }]);
    expect(r.lowWaterCutoff).toEqual({ type: 'float', passed: false });
    expect(r.outcomeRequired).toBe(true);
    expect(isOutcomeRequired(storedResults(r))).toBe(true);
  });

  it('keeps the stop on the phone before the cutoff type is chosen, without a stored cutoff result', () => {
    const r = computeReadingResults({ lowWaterCutoff: { burnerStopped: false } }, boiler);
    expect(codes(r)).toEqual(['low_water_cutoff_failed']);
    expect(r.lowWaterCutoff).toBeNull();
    expect(r.outcomeRequired).toBe(true);
  });

  it('passes a cutoff that stopped the burner', () => {
    const r = computeReadingResults({ lowWaterCutoff: { type: 'probe', burnerStopped: true } }, boiler);
    expect(r.flags).toEqual([]);
    expect(storedResults(r).lowWaterCutoff).toEqual({ type: 'probe', passed: true });
    expect(r.outcomeRequired).toBe(false);
  });

  it('stores flags in one order: combustion, gas rating, gauge glass, low-water cutoff', () => {
    const r = computeReadingResults({ ...clocked(30), gaugeGlassLevel: 'empty', lowWaterCutoff: { type: 'float', burnerStopped: false } }, boiler);
    expect(codes(r)).toEqual(['gas_input_over_fired', 'no_water_visible', 'low_water_cutoff_failed']);
    expect(r.stopFlags.map((f) => f.code)).toEqual(['no_water_visible', 'low_water_cutoff_failed']);
  });

  it('keys a refusal like the form: the block’s own field, else the block', () => {
    const level = computeReadingResults({ gaugeGlassLevel: 'half' }, boiler);
    expect(refusalsOf(level)).toMatchObject([{ key: 'readings.gaugeGlassLevel', field: 'level' }]);
    expect(storedResults(level)).toEqual({ flags: [] });
    const dial = computeReadingResults({ gasInput: { dialCubicFeet: -1, secondsPerRevolution: 30, heatingValueBtuPerCubicFoot: 1000 } }, boiler);
    expect(refusalsOf(dial)).toMatchObject([{ key: 'readings.gasInput.dialCubicFeet', field: 'dialCubicFeet' }]);
    expect(refusalsOf(dial)[0].message).not.toMatch(/^dialCubicFeet: /);
  });

  it('leaves half-typed blocks and an unknown appliance uncomputed', () => {
    const r = computeReadingResults({ gasInput: { dialCubicFeet: 1 }, combustion: { o2Pct: 5, coPpm: 20, flueTempF: 400, airTempF: 70 } }, undefined);
    expect(r.gasInput).toBeNull();
    expect(r.combustion).toBeNull();
    expect(storedResults(r)).toEqual({ flags: [] });
  });
});

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
    // from memory: ASME BPVC Section IV, low-water fuel cutoff: the fuel must be cut off; a burner that kept firing failed
    const r = computeReadingResults({ lowWaterCutoff: { type: 'float', burnerStopped: false } }, boiler);
    expect(r.flags).toMatchObject([{ code: 'low_water_cutoff_failed', severity: 'stop' }]);
    expect(r.lowWaterCutoff).toEqual({ type: 'float', passed: false, trippedWith: null });
    expect(r.outcomeRequired).toBe(true);
    expect(isOutcomeRequired(storedResults(r))).toBe(true);
  });

  it('keeps the stop on the phone before the cutoff type is chosen, without a stored cutoff result', () => {
    const r = computeReadingResults({ lowWaterCutoff: { burnerStopped: false } }, boiler);
    expect(codes(r)).toEqual(['low_water_cutoff_failed']);
    expect(r.lowWaterCutoff).toBeNull();
    expect(r.outcomeRequired).toBe(true);
  });

  it('passes a cutoff only when it stopped the burner with water still visible in the glass', () => {
    // from memory: ASME BPVC Section IV, low-water fuel cutoff at the lowest visible part of the gauge glass
    const r = computeReadingResults({ lowWaterCutoff: { type: 'probe', burnerStopped: true, trippedWith: 'water_visible' } }, boiler);
    expect(r.flags).toEqual([]);
    expect(storedResults(r).lowWaterCutoff).toEqual({ type: 'probe', passed: true, trippedWith: 'water_visible' });
    expect(r.outcomeRequired).toBe(false);
  });

  it('fails a cutoff that stopped the burner only with the water out of sight: a stop, outcome required', () => {
    // from memory: ASME BPVC Section IV: cut off before the water falls below the lowest visible part of the glass
    const r = computeReadingResults({ lowWaterCutoff: { type: 'float', burnerStopped: true, trippedWith: 'below_visible' } }, boiler);
    expect(r.flags).toMatchObject([{ code: 'low_water_cutoff_tripped_too_low', severity: 'stop' }]);
    expect(r.flags[0].source).toMatch(/ASME Boiler and Pressure Vessel Code, Section IV/);
    expect(r.lowWaterCutoffFailed).toBe(true);
    expect(storedResults(r).lowWaterCutoff).toEqual({ type: 'float', passed: false, trippedWith: 'below_visible' });
    expect(isOutcomeRequired(storedResults(r))).toBe(true);
  });

  it('does not pass a cutoff whose trip level against the glass is not recorded yet', () => {
    const r = computeReadingResults({ lowWaterCutoff: { type: 'float', burnerStopped: true } }, boiler);
    expect(r.lowWaterCutoff).toBeNull();
    expect(r.flags).toEqual([]);
  });

  it('a thermocouple judged "replace" raises a flag', () => {
    // from memory: replace below about 18 mV open circuit (see shared/reference/trade-sources.md)
    const r = computeReadingResults({ thermocouple: { openCircuitMv: 12 } }, boiler);
    expect(r.flags).toMatchObject([{ code: 'thermocouple_replace', severity: 'warning', value: 12, threshold: 18 }]);
    expect(codes(computeReadingResults({ thermocouple: { openCircuitMv: 18 } }, boiler))).toEqual([]);
  });

  it('judges a water heater against 200 ppm air-free CO and a boiler against 400 ppm', () => {
    // Source: ANSI Z21.10.1 (secondary): 200 ppm air-free for water heaters; ANSI Z21 vented heating equipment: 400 ppm.
    // O2 0 % keeps air-free CO equal to the reading (factor 20.9 / 20.9); 20 ppm keeps the BPI flue bands out of it.
    const sample = (coPpm: number, o2Pct: number) => ({ combustion: { o2Pct, coPpm, flueTempF: 400, airTempF: 70 } });
    // CO 100 ppm at 10.45 % O2 is 200 ppm air-free (factor 2); 101 ppm is 202 ppm.
    const heater: ResultFacts = { ...boiler, kind: 'water_heater' };
    expect(codes(computeReadingResults(sample(100, 10.45), heater))).not.toContain('air_free_co_above_certification_limit');
    const over = computeReadingResults(sample(101, 10.45), heater);
    expect(over.flags.find((f) => f.code === 'air_free_co_above_certification_limit')).toMatchObject({ threshold: 200, source: expect.stringMatching(/Z21\.10\.1/) });
    expect(over.combustion?.ok && over.combustion.value.coAirFreeLimitPpm).toBe(200);
    const asBoiler = computeReadingResults(sample(101, 10.45), { ...boiler, kind: 'hot_water_boiler' });
    expect(codes(asBoiler)).not.toContain('air_free_co_above_certification_limit');
    expect(asBoiler.combustion?.ok && asBoiler.combustion.value.coAirFreeLimitPpm).toBe(400);
  });

  it('derates the nameplate for the site elevation: 97.5 % of nameplate at 5,280 ft is over-fired', () => {
    // Source: NFPA 54 (secondary copy, older edition): 4 % per 1,000 ft above 2,000 ft → 21.12 % at 5,280 ft, so
    // 100,000 Btu/h allows 78,880 Btu/h. 1 ft³ in 36.923 s at 1,000 Btu/ft³ is 97,500 Btu/h.
    const reading = { gasInput: { dialCubicFeet: 1, secondsPerRevolution: 3600 / 97.5, heatingValueBtuPerCubicFoot: 1000 } };
    expect(codes(computeReadingResults(reading, boiler))).toEqual([]);
    const high = computeReadingResults(reading, { ...boiler, elevationFt: 5280 });
    expect(high.gasInput?.ok && high.gasInput.value.rating?.allowedBtuPerHour).toBeCloseTo(78_880, 6);
    expect(high.flags).toMatchObject([{ code: 'gas_input_over_fired', threshold: 78_880 }]);
    expect(high.flags[0].message).toMatch(/derated 21\.1 %/);
  });

  it('stores flags in one order: combustion, gas rating, thermocouple, gauge glass, low-water cutoff', () => {
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

import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { analyzeCombustion, bpiMinimumDraftPa, combustionSafetyFlags, pascalToInWc, type CombustionInput } from '../../../shared/trade/index';
import { readingsInput } from '../../../shared/schemas/visits';
import { outOf, refusedOn } from './reading-guards';

const base: CombustionInput = { fuel: 'natural_gas', o2Pct: 6, coPpm: 10, flueTempF: 400, airTempF: 70, ventType: 'draft_hood' };
const flag = (input: Partial<CombustionInput>, code: string) => analyzeCombustion({ ...base, ...input }).flags.find((f) => f.code === code);

describe('minimum draft by outdoor temperature', () => {
  // from memory: BPI Technical Standards for the Building Analyst Professional, "minimum acceptable draft" table:
  // below 10 °F −2.5 Pa; 10–90 °F (T/40 − 2.75) Pa; above 90 °F −0.5 Pa.
  it.each([
    [0, -2.5],
    [40, -1.75],
    [80, -0.75],
    [95, -0.5],
  ])('%s °F outdoors → %s Pa', (outdoorF, minimumPa) => {
    expect(bpiMinimumDraftPa(outdoorF)).toBeCloseTo(minimumPa, 10);
  });

  it('is continuous at the table’s edges and never stricter than the cold end', () => {
    expect(bpiMinimumDraftPa(10)).toBeCloseTo(-2.5, 10);
    expect(bpiMinimumDraftPa(90)).toBeCloseTo(-0.5, 10);
    fc.assert(fc.property(fc.double({ min: -60, max: 130, noNaN: true }), (t) => bpiMinimumDraftPa(t) >= -2.5 && bpiMinimumDraftPa(t) <= -0.5));
  });

  it('judges the same draft by the day: −1.5 Pa fails at 0 °F and 40 °F, passes at 80 °F', () => {
    const draftInWc = pascalToInWc(-1.5);
    expect(flag({ draftInWc, outdoorTempF: 0 }, 'draft_below_minimum')).toMatchObject({ severity: 'warning', threshold: -2.5, unit: 'Pa' });
    expect(flag({ draftInWc, outdoorTempF: 40 }, 'draft_below_minimum')?.threshold).toBeCloseTo(-1.75, 10);
    expect(flag({ draftInWc, outdoorTempF: 80 }, 'draft_below_minimum')).toBeUndefined();
    expect(flag({ draftInWc, outdoorTempF: 80, ventType: 'barometric_damper' }, 'draft_below_minimum')).toBeUndefined();
  });

  it('without an outdoor temperature the cold-weather minimum is applied and said', () => {
    const f = flag({ draftInWc: pascalToInWc(-1.5) }, 'draft_below_minimum');
    expect(f?.threshold).toBe(-2.5);
    expect(f?.message).toMatch(/No outdoor temperature/);
  });

  it('refuses out-of-range and non-finite outdoor temperatures', () => {
    fc.assert(fc.property(outOf('outdoorTempF'), (v) => refusedOn(() => bpiMinimumDraftPa(v)) === 'outdoorTempF'));
    fc.assert(fc.property(outOf('outdoorTempF'), (v) => refusedOn(() => analyzeCombustion({ ...base, outdoorTempF: v })) === 'outdoorTempF'));
    fc.assert(fc.property(outOf('outdoorTempF'), (v) => refusedOn(() => combustionSafetyFlags({ coPpm: 1, coAirFreePpm: 1, outdoorTempF: v })) === 'outdoorTempF'));
  });

  it('the readings schema takes it and names its range', () => {
    const ok = readingsInput.safeParse({ combustion: { o2Pct: 6, coPpm: 10, flueTempF: 400, airTempF: 70, outdoorTempF: -5 } });
    expect(ok.success).toBe(true);
    const bad = readingsInput.safeParse({ combustion: { o2Pct: 6, coPpm: 10, flueTempF: 400, airTempF: 70, outdoorTempF: 500 } });
    expect(bad.error?.issues.find((i) => i.path.join('.') === 'combustion.outdoorTempF')?.message).toMatch(/from −60 to 130 °F/);
  });
});

describe('spillage with a barometric damper', () => {
  it('over 60 s is a stop, as for a draft hood', () => {
    // Source: BPI Technical Standards for the Building Analyst (secondary): spillage > 60 s after start-up fails;
    // from memory: BPI: the same spillage test is made at the barometric draft control.
    const f = flag({ ventType: 'barometric_damper', spillageSeconds: 75 }, 'spillage_over_limit');
    expect(f).toMatchObject({ severity: 'stop', value: 75, threshold: 60, unit: 's' });
    expect(f?.message).toMatch(/Barometric-damper/);
    expect(flag({ ventType: 'barometric_damper', spillageSeconds: 60 }, 'spillage_over_limit')).toBeUndefined();
    expect(flag({ ventType: 'direct_vent', spillageSeconds: 120 }, 'spillage_over_limit')).toBeUndefined();
  });

  it('spillage with CO over 100 ppm on an oil burner is a stop', () => {
    // from memory: BPI-1200 flue-CO action levels: over 100 ppm with spillage → stop
    expect(flag({ fuel: 'oil_no2', ventType: 'barometric_damper', spillageSeconds: 90, coPpm: 150 }, 'flue_co_stop')).toMatchObject({ severity: 'stop' });
  });
});

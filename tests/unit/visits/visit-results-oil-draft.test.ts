import { describe, expect, it } from 'vitest';
import { computeReadingResults, refusalsOf, storedResults, type ResultFacts } from '../../../shared/visits/visit-results';
import { pascalToInWc } from '../../../shared/trade/index';

const oilBoiler: ResultFacts = { fuel: 'oil_no2', ventType: 'barometric_damper', construction: 'cast_iron', inputBtuh: 119_000 };
const combustion = { o2Pct: 5, coPpm: 10, flueTempF: 450, airTempF: 65 };

describe('computeReadingResults: oil burner and draft by outdoor temperature', () => {
  it('gives the firing rate beside the nameplate and stores it', () => {
    // Source: flow ∝ √pressure from the nozzle's 100 psi rating; 0.75·√1.4 = 0.8874 gph × 138,000 Btu/gal
    // (from memory: 40 CFR 98 Table C-1, No. 2 oil, HHV) = 122,462 Btu/h.
    const r = computeReadingResults({ oil: { nozzleGph: 0.75, pumpPressurePsi: 140 } }, oilBoiler);
    const stored = storedResults(r).oil;
    expect(stored?.firingRate?.inputBtuPerHour).toBeCloseTo(122_462, -1);
    expect(stored?.firingRate?.nameplateBtuPerHour).toBe(119_000);
  });

  it('flags smoke No. 3 on an older burner but not No. 2', () => {
    // from memory: BNL / NORA oilheat guidance: non-retention burners No. 2 or less
    expect(computeReadingResults({ oil: { smokeSpot: 2, burnerType: 'non_retention' } }, oilBoiler).flags).toEqual([]);
    expect(computeReadingResults({ oil: { smokeSpot: 3, burnerType: 'non_retention' } }, oilBoiler).flags.map((f) => f.code)).toEqual(['smoke_over_limit']);
  });

  it('refuses a half-typed fraction of a smoke number on its field', () => {
    const r = computeReadingResults({ oil: { smokeSpot: 1.5 } }, oilBoiler);
    expect(refusalsOf(r)[0]).toMatchObject({ key: 'readings.oil.smokeSpot' });
  });

  it('judges draft by the outdoor temperature and spillage on a barometric damper', () => {
    // from memory: BPI minimum-draft table: −1.5 Pa fails at 0 °F (−2.5 Pa), passes at 80 °F (−0.75 Pa)
    const draftInWc = pascalToInWc(-1.5);
    const cold = computeReadingResults({ combustion: { ...combustion, draftInWc, outdoorTempF: 0 } }, oilBoiler);
    const mild = computeReadingResults({ combustion: { ...combustion, draftInWc, outdoorTempF: 80 } }, oilBoiler);
    expect(cold.flags.map((f) => f.code)).toContain('draft_below_minimum');
    expect(mild.flags.map((f) => f.code)).not.toContain('draft_below_minimum');
    // Source: BPI (secondary): spillage over 60 s fails; the barometric case is from memory
    const spilled = computeReadingResults({ combustion: { ...combustion, spillageSeconds: 90 } }, oilBoiler);
    expect(spilled.stopFlags.map((f) => f.code)).toContain('spillage_over_limit');
    expect(spilled.outcomeRequired).toBe(true);
  });
});

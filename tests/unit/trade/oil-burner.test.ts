import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { oilFiringRate, smokeNumberFlags } from '../../../shared/trade/index';
import { outOf, refusedOn } from './reading-guards';

describe('oil firing rate from the nozzle and the pump pressure', () => {
  it('a 0.75 gph nozzle at 140 psi fires about 0.89 gph, 122,500 Btu/h', () => {
    // Source: nozzle makers' published flow tables: 0.75 gph (100 psi) delivers 0.89 gph at 140 psi (from memory);
    // flow ∝ √pressure: 0.75·√1.4 = 0.8874 gph; × 138,000 Btu/gal (from memory: 40 CFR 98 Table C-1, No. 2 oil, HHV).
    const rate = oilFiringRate({ nozzleGph: 0.75, pumpPressurePsi: 140 });
    expect(rate.gallonsPerHour).toBeCloseTo(0.8874, 4);
    expect(rate.inputBtuPerHour).toBeCloseTo(122_462, -1);
    expect(rate.basis).toMatch(/HHV/);
  });

  it('at the rating pressure the nozzle fires its rating', () => {
    expect(oilFiringRate({ nozzleGph: 1, pumpPressurePsi: 100 }).gallonsPerHour).toBe(1);
  });

  it('refuses out-of-range and non-finite readings', () => {
    fc.assert(fc.property(outOf('nozzleGph'), (v) => refusedOn(() => oilFiringRate({ nozzleGph: v, pumpPressurePsi: 140 })) === 'nozzleGph'));
    fc.assert(fc.property(outOf('pumpPressurePsi'), (v) => refusedOn(() => oilFiringRate({ nozzleGph: 0.75, pumpPressurePsi: v })) === 'pumpPressurePsi'));
  });
});

describe('smoke number on the ASTM D2156 scale', () => {
  it('a flame-retention burner passes No. 1 and is flagged at No. 2', () => {
    // from memory: BNL / NORA oilheat guidance: flame-retention burners at a trace (No. 1) at most
    expect(smokeNumberFlags({ smokeNumber: 1, burnerType: 'flame_retention' })).toEqual([]);
    expect(smokeNumberFlags({ smokeNumber: 2, burnerType: 'flame_retention' })[0]).toMatchObject({ code: 'smoke_over_limit', threshold: 1 });
  });

  it('an older non-retention burner passes No. 2 and is flagged at No. 3', () => {
    // from memory: BNL / NORA oilheat guidance: non-retention burners No. 2 or less
    expect(smokeNumberFlags({ smokeNumber: 2, burnerType: 'non_retention' })).toEqual([]);
    expect(smokeNumberFlags({ smokeNumber: 3, burnerType: 'non_retention' })[0]).toMatchObject({ code: 'smoke_over_limit', threshold: 2 });
  });

  it('without the burner type the stricter limit is applied and said', () => {
    expect(smokeNumberFlags({ smokeNumber: 2 })[0]?.message).toMatch(/burner type not given/);
  });

  it('refuses readings off the 0–9 scale, fractions and non-finite values', () => {
    fc.assert(fc.property(outOf('smokeNumber'), (v) => refusedOn(() => smokeNumberFlags({ smokeNumber: v })) === 'smokeNumber'));
    expect(refusedOn(() => smokeNumberFlags({ smokeNumber: 1.5 }))).toBe('smokeNumber');
  });
});

import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { combustionEfficiencyPct, combustionLossesPctHhv, excessAirPctFromO2 } from '../../../shared/trade/combustion-efficiency';
import { COMBUSTION_FUELS, FUEL_MODELS } from '../../../shared/trade/fuels';
import { sensibleEnthalpyKjPerMol } from '../../../shared/trade/gas-enthalpy';
import { KJ_PER_BTU } from '../../../shared/trade/units';

// Source: US DOE, Steam Tip Sheet #4, "Improve Your Boiler's Combustion Efficiency" (2006), secondary copy.
// Natural gas: O2 in dry flue gas → excess air.
const DOE_O2_TO_EXCESS_AIR: Array<[o2Pct: number, excessAirPct: number]> = [
  [2, 9.5],
  [3, 15.0],
  [5, 28.1],
  [7, 44.9],
  [10, 81.6],
];

// Source: US DOE, Steam Tip Sheet #4 (2006), secondary copy. Natural gas, HHV basis.
const DOE_EFFICIENCY: Array<[excessAirPct: number, flueMinusAirF: number, efficiencyPct: number]> = [
  [9.5, 300, 83.1],
  [44.9, 400, 78.2],
];

describe('excess air from O2, natural gas, against the DOE table', () => {
  it.each(DOE_O2_TO_EXCESS_AIR)('O2 %s %% gives excess air %s %% (within 0.6 points)', (o2, published) => {
    // Source: US DOE Steam Tip Sheet #4 (2006), secondary copy. Model error is at most 0.16 points (at 10 % O2).
    expect(Math.abs(excessAirPctFromO2('natural_gas', o2) - published)).toBeLessThanOrEqual(0.6);
  });

  it('is not the shortcut O2/(20.9 − O2), which misses the table', () => {
    // Source: US DOE Steam Tip Sheet #4 (2006), secondary copy: 10 % O2 → 81.6 % excess air
    const shortcut = (100 * 10) / (20.9 - 10); // 91.7 %
    expect(Math.abs(shortcut - 81.6)).toBeGreaterThan(5);
    expect(Math.abs(excessAirPctFromO2('natural_gas', 10) - 81.6)).toBeLessThan(0.6);
  });

  it('is zero at zero O2 for every fuel', () => {
    // Definition: no excess O2 in the flue gas means a stoichiometric burn
    for (const fuel of COMBUSTION_FUELS) expect(excessAirPctFromO2(fuel, 0)).toBe(0);
  });
});

// from memory: US DOE Steam Tip Sheet #4 (2006): the whole natural-gas grid (rows: excess air %, columns: flue minus
// combustion-air temperature, °F), HHV basis. Its two cells in the sources file (9.5 %/300 °F, 44.9 %/400 °F) agree.
// The sheet states its assumptions as complete combustion and no water vapour in the combustion air (from memory).
const DOE_RISES_F = [200, 300, 400, 500, 600] as const;
const DOE_GRID_FROM_MEMORY: Array<[excessAirPct: number, efficiencyPct: readonly number[]]> = [
  [9.5, [85.4, 83.1, 80.8, 78.4, 76.0]],
  [15.0, [85.2, 82.8, 80.4, 77.9, 75.4]],
  [28.1, [84.7, 82.1, 79.5, 76.7, 74.0]],
  [44.9, [84.1, 81.2, 78.2, 75.2, 72.1]],
  [81.6, [82.8, 79.3, 75.6, 71.9, 68.2]],
];
const DOE_CELLS_FROM_MEMORY = DOE_GRID_FROM_MEMORY.flatMap(([excessAirPct, row]) =>
  row.map((efficiencyPct, i) => [excessAirPct, DOE_RISES_F[i], efficiencyPct] as const),
);

/**
 * Expected residual, model minus table: the table's flue loss is about 2 % larger than the model's on every cell
 * (0.30 points at 9.5 %/200 °F up to 0.61 at 44.9 %/600 °F), in proportion to the loss itself: residual = 0.020 ×
 * (100 − model efficiency) within 0.1 point (the table is rounded to 0.1). A share of the whole loss, latent and
 * sensible alike, is what a heat input 2 % smaller per mole of flue products would give; none of the sheet's stated
 * assumptions explains it, and the candidates checked below move the other way or are excluded by the sheet:
 * - humidity: the sheet assumes no water vapour in the combustion air, and the model has none;
 * - heat capacities: the fits give enthalpies within 1 % of the tabulated ones and on the high side for N2 (most of
 *   the flue gas), so tabulated values would raise the efficiency, not lower it;
 * - latent heat: the model's latent loss is methane's (HHV − LHV)/HHV at 25 °C;
 * - fuel composition: pipeline gas (Method 19 Fw − Fd) forms less water per heat input than methane, so it would raise
 *   the efficiency too;
 * - radiation: not part of combustion efficiency, and a fixed allowance would not grow with the loss.
 */
const EXPECTED_LOSS_SHARE_MISSING = 0.02;

describe('combustion efficiency, natural gas, against the DOE table', () => {
  it.each(DOE_EFFICIENCY)('%s %% excess air, %s °F rise gives %s %% (within 0.5 points)', (excessAirPct, flueMinusAirF, published) => {
    // Source: US DOE Steam Tip Sheet #4 (2006), secondary copy. The model reads 0.34 points high at the first cell and
    // 0.46 points high at the second: see EXPECTED_LOSS_SHARE_MISSING.
    const computed = combustionEfficiencyPct({ fuel: 'natural_gas', excessAirPct, flueMinusAirF });
    expect(Math.abs(computed - published)).toBeLessThanOrEqual(0.5);
  });

  it('follows the DOE table from O2 straight to efficiency', () => {
    // Source: US DOE Steam Tip Sheet #4 (2006), secondary copy: 2 % O2 ↔ 9.5 % EA; 9.5 % EA, 300 °F → 83.1 %
    const excessAirPct = excessAirPctFromO2('natural_gas', 2);
    expect(Math.abs(combustionEfficiencyPct({ fuel: 'natural_gas', excessAirPct, flueMinusAirF: 300 }) - 83.1)).toBeLessThanOrEqual(0.5);
  });

  it.each(DOE_CELLS_FROM_MEMORY)('%s %% excess air, %s °F rise, table %s %%: reads high by 2 %% of the flue loss', (excessAirPct, flueMinusAirF, published) => {
    // from memory: US DOE Steam Tip Sheet #4 (2006), natural-gas grid; expected residual explained above
    const computed = combustionEfficiencyPct({ fuel: 'natural_gas', excessAirPct, flueMinusAirF });
    const residual = computed - published;
    expect(residual).toBeGreaterThan(0.25);
    expect(residual).toBeLessThan(0.65);
    expect(Math.abs(residual - EXPECTED_LOSS_SHARE_MISSING * (100 - computed))).toBeLessThanOrEqual(0.1);
  });
});

describe('what the DOE residual is not', () => {
  it('the enthalpy fits are within 1.1 % of the ideal-gas tables, N2 on the high side', () => {
    // from memory: Çengel & Boles, Tables A-18 (N2), A-19 (O2), A-20 (CO2), A-23 (H2O): h(500 K) − h(298 K), kJ/kmol
    const tabulated = { N2: 14_581 - 8_669, O2: 14_770 - 8_682, CO2: 17_678 - 9_364, H2O: 16_828 - 9_904 } as const;
    for (const [species, kjPerKmol] of Object.entries(tabulated) as [keyof typeof tabulated, number][]) {
      const fromFit = sensibleEnthalpyKjPerMol(species, 298.15, 500) * 1000;
      expect(Math.abs(fromFit / kjPerKmol - 1)).toBeLessThan(0.011);
    }
    expect(sensibleEnthalpyKjPerMol('N2', 298.15, 500) * 1000).toBeGreaterThan(tabulated.N2);
  });

  it('the latent loss at no excess air is methane’s (HHV − LHV)/HHV', () => {
    // from memory: Çengel & Boles, Table A-27: methane HHV 55,530 kJ/kg, LHV 50,050 kJ/kg → 9.87 %
    const { latentPctHhv } = combustionLossesPctHhv({ fuel: 'natural_gas', excessAirPct: 0, flueMinusAirF: 0 });
    expect(latentPctHhv).toBeCloseTo((100 * (55_530 - 50_050)) / 55_530, 1);
  });

  it('pipeline gas forms less water per heat input than the methane model, so it would raise the efficiency', () => {
    // from memory: 40 CFR Part 60, Appendix A, Method 19, Table 19-2: natural gas Fw 10,610 wscf/MMBtu, Fd 8,710 dscf/MMBtu
    const pipelineWaterScfPerMmbtu = 10_610 - 8_710;
    const m = FUEL_MODELS.natural_gas;
    const scfPerMol20C = ((8.314462618 * 293.15) / 101_325) * 35.3146667;
    const methaneWaterScfPerMmbtu = ((m.hydrogenAtomMol / 2) * scfPerMol20C) / (m.hhvKj / KJ_PER_BTU / 1e6);
    expect(methaneWaterScfPerMmbtu).toBeGreaterThan(pipelineWaterScfPerMmbtu * 1.04);
  });
});

describe('efficiency properties', () => {
  const fuel = fc.constantFrom(...COMBUSTION_FUELS);

  it('falls as the flue temperature rises', () => {
    fc.assert(
      fc.property(fuel, fc.double({ min: 0, max: 300, noNaN: true }), fc.integer({ min: 0, max: 1200 }), fc.integer({ min: 1, max: 200 }), (f, ea, rise, extra) => {
        const cooler = combustionEfficiencyPct({ fuel: f, excessAirPct: ea, flueMinusAirF: rise, airTempF: 60 });
        const hotter = combustionEfficiencyPct({ fuel: f, excessAirPct: ea, flueMinusAirF: rise + extra, airTempF: 60 });
        return hotter < cooler;
      }),
    );
  });

  it('falls as excess air rises (for any flue temperature above the air)', () => {
    fc.assert(
      fc.property(fuel, fc.double({ min: 0, max: 300, noNaN: true }), fc.double({ min: 0.5, max: 100, noNaN: true }), fc.integer({ min: 20, max: 1200 }), (f, ea, more, rise) => {
        const a = combustionEfficiencyPct({ fuel: f, excessAirPct: ea, flueMinusAirF: rise });
        const b = combustionEfficiencyPct({ fuel: f, excessAirPct: ea + more, flueMinusAirF: rise });
        return b < a;
      }),
    );
  });

  it('excess air rises with O2', () => {
    fc.assert(
      fc.property(fuel, fc.double({ min: 0, max: 20.8, noNaN: true }), fc.double({ min: 0.001, max: 20, noNaN: true }), (f, o2, step) => {
        const higher = Math.min(o2 + step, 20.89);
        return higher <= o2 || excessAirPctFromO2(f, higher) > excessAirPctFromO2(f, o2);
      }),
    );
  });
});

import {
  AIR_O2_FRACTION,
  FUEL_MODELS,
  requireFuel,
  stoichiometricDryProductsMol,
  stoichiometricO2Mol,
  type CombustionFuel,
} from './fuels';
import { sensibleEnthalpyKjPerMol, WATER_LATENT_HEAT_25C_KJ_PER_MOL } from './gas-enthalpy';
import { requireReading } from './reading-ranges';
import { requireNumber } from './trade-input-error';
import { fahrenheitDeltaToKelvin, fahrenheitToKelvin } from './units';

/** Plausibility limits (entry errors beyond them). The cp fits hold from 273 K to 1800 K; air below 32 °F extrapolates mildly. */
export const AIR_TEMP_RANGE_F = { min: -40, max: 140 } as const;
export const MAX_FLUE_TEMP_F = 1500;

const REFERENCE_K = 298.15; // heating values and the latent heat are stated at 25 °C

/**
 * Excess air (%, no heating-value basis: a ratio of air quantities) from O2 measured in dry flue gas, from the fuel's stoichiometry:
 * O2 = e·s / (P + e·s/a)  ⇒  e = O2·P / (s·(1 − O2/a)), with s the stoichiometric O2, P the stoichiometric dry
 * products and a the O2 fraction of air. The shortcut O2/(20.9 − O2) ignores P/s and misses the DOE table.
 */
export function excessAirPctFromO2(fuel: CombustionFuel, o2Pct: number): number {
  const model = FUEL_MODELS[requireFuel('fuel', fuel)];
  const x = requireReading('o2Pct', o2Pct) / 100;
  const s = stoichiometricO2Mol(model);
  return (100 * x * stoichiometricDryProductsMol(model)) / (s * (1 - x / AIR_O2_FRACTION));
}

export type EfficiencyInput = {
  fuel: CombustionFuel;
  excessAirPct: number;
  /** Flue-gas temperature minus combustion-air temperature, °F. */
  flueMinusAirF: number;
  /** Combustion-air temperature; defaults to 77 °F (25 °C), the reference temperature of the heating values. */
  airTempF?: number;
};

export type CombustionLossesPct = {
  /** Heat carried up the flue by the dry gas and the water vapour, above combustion-air conditions, % of HHV. */
  sensiblePctHhv: number;
  /** Latent heat of the water formed from the fuel's hydrogen, % of HHV. */
  latentPctHhv: number;
};

/**
 * Flue losses by the heat-loss method, both as % of the higher heating value (HHV basis): dry flue-gas loss plus loss
 * from the moisture formed by burning hydrogen (latent heat included). Excludes jacket/radiation losses, unburned fuel
 * and moisture carried in by the air (dry air, as US DOE Steam Tip Sheet #4 assumes).
 */
export function combustionLossesPctHhv(input: EfficiencyInput): CombustionLossesPct {
  const model = FUEL_MODELS[requireFuel('fuel', input.fuel)];
  const e = requireNumber('excessAirPct', input.excessAirPct, { min: 0 }) / 100;
  const rise = requireNumber('flueMinusAirF', input.flueMinusAirF, { min: 0 });
  const airF = requireNumber('airTempF', input.airTempF ?? 77, AIR_TEMP_RANGE_F);
  requireNumber('flueTempF', airF + rise, { max: MAX_FLUE_TEMP_F });

  const airK = fahrenheitToKelvin(airF);
  const flueK = airK + fahrenheitDeltaToKelvin(rise);
  const s = stoichiometricO2Mol(model);
  const inertPerO2 = (1 - AIR_O2_FRACTION) / AIR_O2_FRACTION;
  const airO2 = s * (1 + e);
  const products = {
    CO2: model.carbonMol,
    SO2: model.sulfurMol,
    H2O: model.hydrogenAtomMol / 2,
    O2: s * e,
    N2: airO2 * inertPerO2,
  } as const;

  // Energy balance referenced to 25 °C: products carried up to flue temperature, less the heat the combustion air
  // brought in above 25 °C (negative when the air is colder).
  let sensibleKj = 0;
  for (const [species, mol] of Object.entries(products) as [keyof typeof products, number][]) {
    sensibleKj += mol * sensibleEnthalpyKjPerMol(species, REFERENCE_K, flueK);
  }
  sensibleKj -= airO2 * sensibleEnthalpyKjPerMol('O2', REFERENCE_K, airK);
  sensibleKj -= airO2 * inertPerO2 * sensibleEnthalpyKjPerMol('N2', REFERENCE_K, airK);
  const latentKj = products.H2O * WATER_LATENT_HEAT_25C_KJ_PER_MOL;

  return { sensiblePctHhv: (100 * sensibleKj) / model.hhvKj, latentPctHhv: (100 * latentKj) / model.hhvKj };
}

/**
 * Combustion efficiency, % of the higher heating value (HHV basis, gross): 100 − flue losses (see
 * combustionLossesPctHhv). Not applicable to condensing operation, where part of the latent heat is recovered.
 * For natural gas it reads 0.3–0.6 points above US DOE Steam Tip Sheet #4 (2006): the table's flue loss is about 2 %
 * larger on every cell, which none of the sheet's stated assumptions explains (tests/unit/trade/combustion-grid.test.ts).
 * Propane and No. 2 oil are not checked against a published efficiency table, only through their stoichiometry.
 */
export function combustionEfficiencyPct(input: EfficiencyInput): number {
  const { sensiblePctHhv, latentPctHhv } = combustionLossesPctHhv(input);
  return 100 - sensiblePctHhv - latentPctHhv;
}

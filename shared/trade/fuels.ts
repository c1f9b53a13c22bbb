import { KG_PER_LB, KJ_PER_BTU } from './units';
import { requireOneOf } from './trade-input-error';

export const COMBUSTION_FUELS = ['natural_gas', 'propane', 'oil_no2'] as const;
export type CombustionFuel = (typeof COMBUSTION_FUELS)[number];

export function requireFuel(field: string, value: unknown): CombustionFuel {
  return requireOneOf(field, value, COMBUSTION_FUELS);
}

/**
 * Dry flue-gas volume (Fd, dscf/MMBtu) and CO2 volume (Fc, scf/MMBtu) per heat input.
 * Source: 40 CFR Part 60, Appendix A, Method 19, Table 19-2 (secondary copy).
 */
export const METHOD_19_F_FACTORS: Readonly<Record<CombustionFuel, { fdDscfPerMmbtu: number; fcScfPerMmbtu: number }>> = {
  natural_gas: { fdDscfPerMmbtu: 8710, fcScfPerMmbtu: 1040 },
  propane: { fdDscfPerMmbtu: 8710, fcScfPerMmbtu: 1190 },
  oil_no2: { fdDscfPerMmbtu: 9190, fcScfPerMmbtu: 1420 },
};
export const METHOD_19_SOURCE = '40 CFR Part 60, Appendix A, Method 19, Table 19-2 (secondary copy)';

/** Highest possible dry CO2 (stoichiometric burn): 100·Fc/Fd. */
export function co2MaxPct(fuel: CombustionFuel): number {
  const f = METHOD_19_F_FACTORS[requireFuel('fuel', fuel)];
  return (100 * f.fcScfPerMmbtu) / f.fdDscfPerMmbtu;
}

/**
 * O2 in dry air by volume; the other 79.05 % (N2, argon, traces) is treated as inert nitrogen.
 * from memory: U.S. Standard Atmosphere, 1976 (O2 20.946 %). Method 19 and the trade formulas use 20.9 instead;
 * 20.95 is used only for the stoichiometry behind excess air and efficiency.
 */
export const AIR_O2_FRACTION = 0.2095;

/** Moles of each element per "basis" amount of fuel, and the higher heating value of that amount. */
export type FuelModel = {
  basis: string;
  carbonMol: number;
  hydrogenAtomMol: number;
  sulfurMol: number;
  hhvKj: number;
  description: string;
  source: string;
};

// Molar masses, g/mol. from memory: IUPAC conventional standard atomic weights.
const C = 12.011;
const H = 1.008;
const S = 32.06;

const btuPerLbToKjPerKg = (btuPerLb: number) => (btuPerLb * KJ_PER_BTU) / KG_PER_LB;

export const FUEL_MODELS: Readonly<Record<CombustionFuel, FuelModel>> = {
  natural_gas: {
    basis: '1 mol',
    carbonMol: 1,
    hydrogenAtomMol: 4,
    sulfurMol: 0,
    // HHV 55,530 kJ/kg × 16.043 g/mol.
    hhvKj: (55_530 * (C + 4 * H)) / 1000,
    description: 'natural gas modelled as pure methane (CH4)',
    source: 'from memory: Çengel & Boles, Thermodynamics: An Engineering Approach, Table A-27 (methane HHV 55,530 kJ/kg)',
  },
  propane: {
    basis: '1 mol',
    carbonMol: 3,
    hydrogenAtomMol: 8,
    sulfurMol: 0,
    hhvKj: (50_330 * (3 * C + 8 * H)) / 1000,
    description: 'propane (C3H8)',
    source: 'from memory: Çengel & Boles, Thermodynamics: An Engineering Approach, Table A-27 (propane HHV 50,330 kJ/kg)',
  },
  oil_no2: {
    basis: '1 kg',
    carbonMol: 873 / C,
    hydrogenAtomMol: 125 / H,
    sulfurMol: 2 / S,
    hhvKj: btuPerLbToKjPerKg(19_500),
    description:
      'No. 2 oil, assumed typical analysis C 87.3 %, H 12.5 %, S 0.2 % by mass, HHV 19,500 Btu/lb; ' +
      'checked only through its stoichiometry (CO2max and Fd against Method 19), not against a published efficiency table',
    // No publication is cited for this analysis; its stoichiometry reproduces Method 19's Fd within 0.2 % (tested).
    source: 'assumed typical analysis and HHV (from memory, no publication cited); stoichiometry checked against Method 19',
  },
};

/** Mol O2 needed to burn one basis amount of fuel completely. */
export const stoichiometricO2Mol = (m: FuelModel): number => m.carbonMol + m.hydrogenAtomMol / 4 + m.sulfurMol;

/** Dry products of a stoichiometric burn (CO2, SO2 and the inert part of the air), mol per basis. */
export function stoichiometricDryProductsMol(m: FuelModel): number {
  const inertPerO2 = (1 - AIR_O2_FRACTION) / AIR_O2_FRACTION;
  return m.carbonMol + m.sulfurMol + stoichiometricO2Mol(m) * inertPerO2;
}

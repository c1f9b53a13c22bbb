/**
 * Ideal-gas heat capacities cp = a + bT + cT² + dT³ (kJ/kmol·K, T in K, valid 273–1800 K).
 * Source: Çengel & Boles, Thermodynamics: An Engineering Approach, Table A-2(c) (secondary copy).
 */
const CP_COEFFICIENTS = {
  N2: [28.9, -0.1571e-2, 0.8081e-5, -2.873e-9],
  O2: [25.48, 1.52e-2, -0.7155e-5, 1.312e-9],
  CO2: [22.26, 5.981e-2, -3.501e-5, 7.469e-9],
  H2O: [32.24, 0.1923e-2, 1.055e-5, -3.595e-9],
  SO2: [25.78, 5.795e-2, -3.812e-5, 8.612e-9],
} as const;

export type FlueGasSpecies = keyof typeof CP_COEFFICIENTS;

export const CP_SOURCE = 'Çengel & Boles, Thermodynamics: An Engineering Approach, Table A-2(c) (secondary copy)';

/** Latent heat of water at 25 °C, kJ/mol (2441.7 kJ/kg × 18.015 g/mol). from memory: steam tables (Çengel & Boles, Table A-4). */
export const WATER_LATENT_HEAT_25C_KJ_PER_MOL = (2441.7 * 18.015) / 1000;

export function heatCapacityKjPerMolK(species: FlueGasSpecies, kelvin: number): number {
  const [a, b, c, d] = CP_COEFFICIENTS[species];
  return (a + b * kelvin + c * kelvin ** 2 + d * kelvin ** 3) / 1000;
}

/** ∫cp dT from `fromK` to `toK`, kJ/mol (negative when toK < fromK). */
export function sensibleEnthalpyKjPerMol(species: FlueGasSpecies, fromK: number, toK: number): number {
  const [a, b, c, d] = CP_COEFFICIENTS[species];
  const h = (t: number) => a * t + (b * t ** 2) / 2 + (c * t ** 3) / 3 + (d * t ** 4) / 4;
  return (h(toK) - h(fromK)) / 1000;
}

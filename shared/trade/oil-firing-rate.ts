import { requireReading } from './reading-ranges';

/** The pressure nozzles are rated at, psi. Source: nozzle makers' published flow tables (rating in gph at 100 psi). */
export const NOZZLE_RATING_PSI = 100;
/**
 * No. 2 fuel oil, higher heating value, Btu per US gallon.
 * from memory: 40 CFR Part 98, Subpart C, Table C-1 (distillate fuel oil No. 2, 0.138 MMBtu/gallon). Trade literature
 * commonly quotes 138,500 Btu/gal; the difference is 0.4 %.
 */
export const NO2_OIL_HHV_BTU_PER_GALLON = 138_000;
export const NO2_OIL_HHV_SOURCE = 'from memory: 40 CFR Part 98, Subpart C, Table C-1, distillate fuel oil No. 2, 0.138 MMBtu/gal (HHV)';

export type OilFiringRate = { gallonsPerHour: number; inputBtuPerHour: number; basis: string };

/** Flow through a pressure-atomizing nozzle goes as the square root of the pressure: gph = rating·√(psi/100). */
export function oilFiringRate(input: { nozzleGph: number; pumpPressurePsi: number }): OilFiringRate {
  const rated = requireReading('nozzleGph', input.nozzleGph);
  const psi = requireReading('pumpPressurePsi', input.pumpPressurePsi);
  const gallonsPerHour = rated * Math.sqrt(psi / NOZZLE_RATING_PSI);
  return {
    gallonsPerHour,
    inputBtuPerHour: gallonsPerHour * NO2_OIL_HHV_BTU_PER_GALLON,
    basis: `flow ∝ √pressure from the nozzle's rating at ${NOZZLE_RATING_PSI} psi; HHV basis, ${NO2_OIL_HHV_SOURCE}`,
  };
}

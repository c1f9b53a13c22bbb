import { requireNumber } from './trade-input-error';

/**
 * From connected radiation to the boiler rating it needs.
 *
 * Steam: 1 sq ft EDR emits 240 Btu/h (standard radiation at 215 °F steam, 70 °F room).
 *   Source: ASHRAE Handbook, HVAC Systems and Equipment, "Hydronic heat-distributing units and radiators"; I=B=R.
 * Hot water: 150 Btu/h per sq ft EDR at 170 °F average water temperature.
 *   from memory: I=B=R Installation Guide for Residential Hydronic Heating Systems (the 150 Btu/h rating basis).
 *   At other temperatures the output scales with (ΔT / 100 °F)^1.3, ΔT = average water − 70 °F room.
 *   from memory: ASHRAE Handbook, HVAC Systems and Equipment (exponent n ≈ 1.3 for cast-iron radiators).
 * Gross output: the net (I=B=R) rating plus the piping and pickup allowance the rating assumes: gross = net × 1.333
 * for steam, × 1.15 for water. from memory: AHRI/I=B=R "Testing and Rating Standard for Heating Boilers", net
 * rating basis (footnote on every I=B=R rating table).
 */
export const STEAM_BTUH_PER_SQFT_EDR = 240;
export const WATER_BTUH_PER_SQFT_EDR_AT_170F = 150;
export const STEAM_PIPING_PICKUP_FACTOR = 1.333;
export const WATER_PIPING_PICKUP_FACTOR = 1.15;
const ROOM_F = 70;
const RADIATOR_EXPONENT = 1.3;

export type HeatingMedium = 'steam' | 'hot_water';

/** Output per sq ft EDR of hot-water radiation at an average water temperature (°F). */
export function waterBtuhPerSqFtEdr(averageWaterF: number): number {
  requireNumber('averageWaterF', averageWaterF, { min: 100, max: 210 });
  return WATER_BTUH_PER_SQFT_EDR_AT_170F * ((averageWaterF - ROOM_F) / 100) ** RADIATOR_EXPONENT;
}

export type BoilerSizing = {
  totalEdrSqFt: number;
  netLoadBtuh: number;
  pipingPickupFactor: number;
  grossOutputBtuh: number;
  /** Boilers whose net rating is at least the load and at most a quarter above it. */
  suitableNetRatingBtuh: { min: number; max: number };
};

/**
 * The required net load and gross output for `totalEdrSqFt` of connected radiation.
 * Steam boilers are sized to the connected radiation, not to the building's heat loss (Holohan, The Lost Art of Steam
 * Heating): the boiler must fill every radiator with steam.
 */
export function sizeBoilerFromEdr(input: { medium: HeatingMedium; totalEdrSqFt: number; averageWaterF?: number }): BoilerSizing {
  const edr = requireNumber('totalEdrSqFt', input.totalEdrSqFt, { minExclusive: 0, max: 20_000 });
  const perSqFt = input.medium === 'steam' ? STEAM_BTUH_PER_SQFT_EDR : waterBtuhPerSqFtEdr(input.averageWaterF ?? 170);
  const factor = input.medium === 'steam' ? STEAM_PIPING_PICKUP_FACTOR : WATER_PIPING_PICKUP_FACTOR;
  const netLoadBtuh = Math.round(edr * perSqFt);
  return {
    totalEdrSqFt: edr,
    netLoadBtuh,
    pipingPickupFactor: factor,
    grossOutputBtuh: Math.round(netLoadBtuh * factor),
    // common practice: the smallest boiler whose net rating covers the load; one more than ~25 % above it is oversized.
    suitableNetRatingBtuh: { min: netLoadBtuh, max: Math.round(netLoadBtuh * 1.25) },
  };
}

import { requireReading } from './reading-ranges';
import { requireNumber } from './trade-input-error';

/** Higher heating values, Btu per standard cubic foot. Source: 40 CFR Part 98, Subpart C, Table C-1. */
export const DEFAULT_HEATING_VALUE_BTU_PER_FT3 = { natural_gas: 1026, propane: 2516 } as const;
export const HEATING_VALUE_SOURCE = '40 CFR Part 98, Subpart C, Table C-1';

const NFPA_54 = 'NFPA 54 (ANSI Z223.1), National Fuel Gas Code, older edition (edition not confirmed), secondary copy';

/** Gas input by clocking the meter: ft³/h = 3600 × dial ft³ / seconds per revolution; Btu/h = ft³/h × heating value. */
export function clockGasInput(input: {
  dialCubicFeet: number;
  secondsPerRevolution: number;
  heatingValueBtuPerCubicFoot: number;
}): { cubicFeetPerHour: number; inputBtuPerHour: number } {
  const dial = requireReading('dialCubicFeet', input.dialCubicFeet);
  const seconds = requireReading('secondsPerRevolution', input.secondsPerRevolution);
  const heatingValue = requireReading('heatingValueBtuPerCubicFoot', input.heatingValueBtuPerCubicFoot);
  const cubicFeetPerHour = (3600 * dial) / seconds;
  return { cubicFeetPerHour, inputBtuPerHour: cubicFeetPerHour * heatingValue };
}

/** Above this elevation the rating is reduced; at or below it, the sea-level rating stands. */
export const ALTITUDE_DERATE_START_FT = 2000;
export const ALTITUDE_DERATE_PCT_PER_1000_FT = 4;

/**
 * Rating reduction for altitude, %. Read as 4 % per 1,000 ft of elevation above sea level, applied only above
 * 2,000 ft (so 5,000 ft → 20 %); that the count starts at sea level is from memory. Appliance instructions govern.
 */
export function altitudeDeratePct(elevationFt: number): number {
  const ft = requireNumber('elevationFt', elevationFt, { min: -1500, max: 15000 });
  return ft > ALTITUDE_DERATE_START_FT ? (ALTITUDE_DERATE_PCT_PER_1000_FT * ft) / 1000 : 0;
}

export type RatingComparison = {
  status: 'over_fired' | 'under_fired' | 'within_rating';
  /** (measured − allowed) / allowed × 100, where allowed is the rating after any altitude derate. */
  deviationPct: number;
  allowedBtuPerHour: number;
  altitudeDeratePct: number;
  source: string;
};

/**
 * Measured input against the nameplate rating. Any input above the (derated) rating is over-firing, which NFPA 54
 * prohibits; under-firing beyond the given tolerance is reported as under-fired.
 */
export function compareInputToRating(input: {
  measuredBtuPerHour: number;
  ratedBtuPerHour: number;
  /** How far below the rating is still accepted, %; a company or manufacturer figure. */
  underFiringTolerancePct: number;
  elevationFt?: number;
}): RatingComparison {
  const measured = requireNumber('measuredBtuPerHour', input.measuredBtuPerHour, { min: 0 });
  const rated = requireNumber('ratedBtuPerHour', input.ratedBtuPerHour, { minExclusive: 0 });
  const tolerance = requireNumber('underFiringTolerancePct', input.underFiringTolerancePct, { min: 0, max: 100 });
  const derate = input.elevationFt === undefined ? 0 : altitudeDeratePct(input.elevationFt);
  const allowed = rated * (1 - derate / 100);
  const deviationPct = ((measured - allowed) / allowed) * 100;
  const status = measured > allowed ? 'over_fired' : deviationPct < -tolerance ? 'under_fired' : 'within_rating';
  const source =
    derate > 0
      ? `${NFPA_54}: over-firing prohibited; ${ALTITUDE_DERATE_PCT_PER_1000_FT} % per 1,000 ft derate above ${ALTITUDE_DERATE_START_FT} ft (secondary)`
      : `${NFPA_54}: over-firing prohibited`;
  return { status, deviationPct, allowedBtuPerHour: allowed, altitudeDeratePct: derate, source };
}

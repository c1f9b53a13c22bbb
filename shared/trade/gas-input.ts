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

/**
 * How far above the (derated) rating a clocked input may read before it is called over-firing. Clocking a meter with
 * a watch against the supplier's average heating value cannot tell a couple of per cent apart.
 * common practice (from memory: appliance installation instructions commonly ask for the clocked input within 2 % of
 * the rating). NFPA 54 itself prohibits over-firing and states no tolerance.
 */
export const OVER_FIRING_TOLERANCE_PCT = 2;
export const OVER_FIRING_TOLERANCE_SOURCE = 'common practice (from memory: appliance instructions commonly allow the clocked input within 2 % of the rating)';

/**
 * The on-screen explanation wherever the derate applies (or nearly does): NFPA 54's wording counts the 4 % steps from
 * sea level but applies them only above 2,000 ft, so the derate jumps from 0 % at 2,000 ft to 8 % at 2,001 ft.
 */
export function altitudeDerateNote(elevationFt: number): string | null {
  const ft = requireNumber('elevationFt', elevationFt, { min: -1500, max: 15000 });
  if (ft < 1500) return null;
  const pct = altitudeDeratePct(ft);
  const applied = pct > 0 ? `At ${ft.toLocaleString('en-US')} ft the nameplate is derated ${pct.toFixed(1)} %.` : `At ${ft.toLocaleString('en-US')} ft no derate applies yet.`;
  return (
    `${applied} NFPA 54 derates ${ALTITUDE_DERATE_PCT_PER_1000_FT} % per 1,000 ft of elevation, but only above ${ALTITUDE_DERATE_START_FT.toLocaleString('en-US')} ft, ` +
    'so as the code is worded the derate steps from 0 % at 2,000 ft straight to 8 % at 2,001 ft rather than rising gradually. ' +
    "The appliance maker's high-altitude instructions and the gas supplier's heating value govern."
  );
}

export type RatingComparison = {
  status: 'over_fired' | 'under_fired' | 'within_rating';
  /** (measured − allowed) / allowed × 100, where allowed is the rating after any altitude derate. */
  deviationPct: number;
  allowedBtuPerHour: number;
  altitudeDeratePct: number;
  /** How far above the allowed input still counts as within rating, %. */
  overFiringTolerancePct: number;
  source: string;
};

/**
 * Measured input against the nameplate rating. An input more than OVER_FIRING_TOLERANCE_PCT above the (derated)
 * rating is over-firing, which NFPA 54 prohibits; under-firing beyond the given tolerance is reported as under-fired.
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
  const status = deviationPct > OVER_FIRING_TOLERANCE_PCT ? 'over_fired' : deviationPct < -tolerance ? 'under_fired' : 'within_rating';
  const base =
    derate > 0
      ? `${NFPA_54}: over-firing prohibited; ${ALTITUDE_DERATE_PCT_PER_1000_FT} % per 1,000 ft derate above ${ALTITUDE_DERATE_START_FT} ft (secondary)`
      : `${NFPA_54}: over-firing prohibited`;
  const source = `${base}; ${OVER_FIRING_TOLERANCE_PCT} % clocking tolerance: ${OVER_FIRING_TOLERANCE_SOURCE}`;
  return { status, deviationPct, allowedBtuPerHour: allowed, altitudeDeratePct: derate, overFiringTolerancePct: OVER_FIRING_TOLERANCE_PCT, source };
}

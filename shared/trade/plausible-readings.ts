import { fahrenheitToCelsius } from './units';

/**
 * The flue temperatures a fired residential boiler can honestly show at the analyzer. Outside this range the probe
 * is in the flame, unplugged or misread, and no result computed from it means anything.
 * common practice: non-condensing boilers run roughly 250–600 °F in the flue; −40 °F is the coldest air a heating
 * appliance draws, so nothing below it can come out of the flue.
 */
export const FLUE_TEMP_PLAUSIBLE_F = { min: -40, max: 1200 } as const;

const c = (f: number) => Math.round(fahrenheitToCelsius(f));
const f = (n: number) => n.toLocaleString('en-US').replace('-', '−');

export const FLUE_TEMP_RANGE_MESSAGE =
  `Flue temperature must be between ${f(FLUE_TEMP_PLAUSIBLE_F.min)} and ${f(FLUE_TEMP_PLAUSIBLE_F.max)} °F ` +
  `(${f(c(FLUE_TEMP_PLAUSIBLE_F.min))} and ${f(c(FLUE_TEMP_PLAUSIBLE_F.max))} °C).`;

/** common practice: at steady firing the flue gas is heated by the fire, so it cannot be colder than the air it was made from. */
export const isFlueBelowCombustionAir = (flueTempF: number, airTempF: number) => flueTempF < airTempF;

export const flueBelowAirMessage = (flueTempF: number, airTempF: number) =>
  `Flue temperature ${f(flueTempF)} °F is below the combustion-air temperature ${f(airTempF)} °F: impossible at steady firing. Check the probe is in the flue and read again.`;

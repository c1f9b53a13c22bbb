import { FLUE_TEMP_PLAUSIBLE_F } from './plausible-readings';
import { TradeInputError } from './trade-input-error';

/**
 * The one place the trade computations say which readings they take. A reading outside its range is an instrument
 * reading that cannot be (the analyzer does not read there) or a physical impossibility; NaN and ±Infinity never pass.
 */
export type ReadingRange = { min?: number; max?: number; minExclusive?: number; maxExclusive?: number; unit: string; why: string };

export const READING_RANGES = {
  // O2 of air is 20.9 %; a flue sample at or above it is air, and every O2 formula divides by (20.9 − O2).
  // from memory: combustion analyzer spec sheets (O2 cell range 0–20.9 % / 0–21 %).
  o2Pct: { min: 0, maxExclusive: 20.9, unit: '%', why: 'the analyzer O2 range; 20.9 % is air' },
  // from memory: combustion analyzer spec sheets (CO cell 0–4,000 ppm, to about 10,000 ppm with dilution).
  coPpm: { min: 0, max: 10_000, unit: 'ppm', why: 'the analyzer CO range' },
  ambientCoPpm: { min: 0, max: 10_000, unit: 'ppm', why: 'the analyzer CO range' },
  flueTempF: { min: FLUE_TEMP_PLAUSIBLE_F.min, max: FLUE_TEMP_PLAUSIBLE_F.max, unit: '°F', why: 'what a fired boiler can show in the flue' },
  // common practice: combustion air is drawn from −40 °F outdoors up to a hot boiler room.
  airTempF: { min: -40, max: 140, unit: '°F', why: 'combustion air a heating appliance draws' },
  // common practice: analyzer draft ranges are a few in. w.c. either way; flue drafts are hundredths of an inch.
  draftInWc: { min: -2, max: 2, unit: 'in. w.c.', why: 'the analyzer draft range' },
  // common practice: the coldest and hottest outdoor air a heating visit meets.
  outdoorTempF: { min: -60, max: 130, unit: '°F', why: 'outdoor air temperature' },
  spillageSeconds: { min: 0, max: 3600, unit: 's', why: 'a spillage test of at most an hour' },
  // common practice: meter test dials are ½ to 10 ft³; a revolution is clocked with a watch, so it takes a real,
  // finite time (a tenth of a second is already far faster than any residential meter turns).
  dialCubicFeet: { min: 0.01, max: 100, unit: 'ft³', why: 'a gas meter test dial' },
  secondsPerRevolution: { min: 0.1, max: 36_000, unit: 's', why: 'a revolution clocked with a watch' },
  // Source: 40 CFR Part 98, Subpart C, Table C-1 (natural gas 1,026, propane 2,516 Btu/scf); the range leaves room for
  // other fuel gases.
  heatingValueBtuPerCubicFoot: { min: 100, max: 5000, unit: 'Btu/ft³', why: 'fuel-gas heating values' },
  // Source: ASTM D2156, smoke density of distillate-fuel flue gas, a scale of 0 to 9.
  smokeNumber: { min: 0, max: 9, unit: '(smoke scale)', why: 'the ASTM D2156 smoke scale' },
  // common practice: residential and light-commercial oil nozzles are rated from about 0.4 to 30 gph at 100 psi.
  nozzleGph: { min: 0.1, max: 30, unit: 'gph at 100 psi', why: 'an oil nozzle rating' },
  // common practice: oil burner pumps are set from about 100 to 200 psi; gauges read to 300 psi.
  pumpPressurePsi: { minExclusive: 0, max: 300, unit: 'psi', why: 'an oil pump pressure gauge' },
  openCircuitMv: { min: 0, max: 100, unit: 'mV', why: 'a thermocouple makes tens of millivolts' },
  closedCircuitMv: { min: 0, max: 100, unit: 'mV', why: 'a thermocouple makes tens of millivolts' },
} as const satisfies Record<string, ReadingRange>;

export type ReadingName = keyof typeof READING_RANGES;

const fmt = (n: number) => n.toLocaleString('en-US', { maximumFractionDigits: 6 }).replace('-', '−');

/** "from 0 to 10,000 ppm (the analyzer CO range)", "at least 0 and below 20.9 % (…)". */
export function describeRange(range: ReadingRange): string {
  const { min, max, minExclusive, maxExclusive } = range;
  const bounds =
    min !== undefined && max !== undefined
      ? `from ${fmt(min)} to ${fmt(max)}`
      : [
          min !== undefined && `at least ${fmt(min)}`,
          minExclusive !== undefined && `above ${fmt(minExclusive)}`,
          max !== undefined && `at most ${fmt(max)}`,
          maxExclusive !== undefined && `below ${fmt(maxExclusive)}`,
        ]
          .filter(Boolean)
          .join(' and ');
  return `${bounds} ${range.unit} (${range.why})`;
}

export function isInRange(range: ReadingRange, value: number): boolean {
  if (!Number.isFinite(value)) return false;
  if (range.min !== undefined && value < range.min) return false;
  if (range.max !== undefined && value > range.max) return false;
  if (range.minExclusive !== undefined && value <= range.minExclusive) return false;
  if (range.maxExclusive !== undefined && value >= range.maxExclusive) return false;
  return true;
}

/** Returns the reading if it is a finite number in its range; otherwise throws TradeInputError naming the range. */
export function requireReading(name: ReadingName, value: unknown, field: string = name): number {
  const range = READING_RANGES[name];
  if (typeof value !== 'number' || !isInRange(range, value)) {
    throw new TradeInputError(field, `must be ${describeRange(range)}, got ${String(value)}`);
  }
  return value;
}

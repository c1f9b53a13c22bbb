import type { ReadingsInput } from '../../../shared/schemas/visits';
import {
  computeReadingResults,
  refusalsOf,
  storedResults,
  type ResultFacts,
  type VisitResults,
} from '../../../shared/visits/visit-results';
import { validationFailed } from '../../lib/http-error';

export type { VisitResults } from '../../../shared/visits/visit-results';

/**
 * The results to store for a visit's readings, by the shared rule the visit editor runs live; the client's numbers
 * are never stored as results. A computation's refusal is a field error keyed like the form.
 */
export function resultsToStore(readings: ReadingsInput, appliance: ResultFacts): VisitResults {
  const results = computeReadingResults(readings, appliance);
  const [refused] = refusalsOf(results);
  if (refused) throw validationFailed({ [refused.key]: [`${refused.field}: ${refused.message}`] });
  return storedResults(results);
}

const isNumber = (v: unknown): v is number => typeof v === 'number';

/** The few numbers a trend chart needs, taken from the server's results. */
export function keyReadings(readings: ReadingsInput, results: VisitResults): Record<string, number> | null {
  const out: Record<string, number> = {};
  if (results.combustion) {
    if (results.combustion.efficiencyPct !== null) out.efficiencyPct = round(results.combustion.efficiencyPct, 1);
    out.coAirFreePpm = round(results.combustion.coAirFreePpm, 0);
    out.co2Pct = round(results.combustion.co2Pct, 1);
  }
  if (readings.combustion) {
    out.flueTempF = readings.combustion.flueTempF;
    out.o2Pct = readings.combustion.o2Pct;
    out.coPpm = readings.combustion.coPpm;
  }
  if (results.gasInput) out.inputBtuPerHour = Math.round(results.gasInput.inputBtuPerHour);
  if (isNumber(readings.thermocouple?.openCircuitMv)) out.thermocoupleOpenCircuitMv = readings.thermocouple.openCircuitMv;
  if (results.gaugeGlass && results.gaugeGlass.fraction !== null) out.gaugeGlassFraction = round(results.gaugeGlass.fraction, 3);
  if (isNumber(readings.steamOperatingPsi)) out.steamOperatingPsi = readings.steamOperatingPsi;
  if (isNumber(readings.fillPressurePsi)) out.fillPressurePsi = readings.fillPressurePsi;
  return Object.keys(out).length ? out : null;
}

const round = (v: number, digits: number) => Number(v.toFixed(digits));

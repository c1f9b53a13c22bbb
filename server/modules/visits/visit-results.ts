import type { Construction, Fuel, VentType } from '../../../shared/schemas/enums';
import type { ReadingsInput } from '../../../shared/schemas/visits';
import {
  analyzeCombustion,
  assessGaugeGlassLevel,
  assessThermocoupleMillivolts,
  clockGasInput,
  compareInputToRating,
  type RatingComparison,
  parseGaugeGlassLevel,
  TradeInputError,
  gasInputRatingFlag,
  type CombustionAnalysis,
  type GaugeGlassAssessment,
  type ThermocoupleAssessment,
  type TradeFlag,
} from '../../../shared/trade/index';
import { validationFailed } from '../../lib/http-error';

export type VisitResults = {
  combustion?: CombustionAnalysis;
  gasInput?: { cubicFeetPerHour: number; inputBtuPerHour: number; rating?: RatingComparison };
  thermocouple?: ThermocoupleAssessment;
  gaugeGlass?: GaugeGlassAssessment;
  lowWaterCutoff?: { type: 'float' | 'probe'; passed: boolean };
  /** Every flag from the computations above, in one list, so the form can show them together. */
  flags: TradeFlag[];
};

type ApplianceFacts = { fuel: Fuel; ventType: VentType; construction: Construction; inputBtuh?: number | null; underFiringTolerancePct?: number | null };

const LOW_WATER_CUTOFF_FAILED: TradeFlag = {
  code: 'low_water_cutoff_failed',
  severity: 'stop',
  message:
    'The burner did not stop when the low-water cutoff was tested: the boiler is not protected against firing dry. ' +
    'Do not leave it firing; follow the control manufacturer’s instructions, local codes and licensed practice.',
  value: null,
  threshold: null,
  unit: null,
  source: 'common practice: a low-water cutoff that does not stop the burner has failed its test',
};

const orUndefined = <T>(v: T | null | undefined): T | undefined => (v === null ? undefined : v);

/**
 * Runs one computation and turns a TradeInputError into a field error keyed like the form
 * (`readings.<group>.<field>`), or `readings.<group>` when the offending input is not one of the group's fields.
 */
function run<T>(group: string, fields: object | string, compute: () => T): T {
  try {
    return compute();
  } catch (err) {
    if (!(err instanceof TradeInputError)) throw err;
    const key = typeof fields === 'object' && Object.hasOwn(fields, err.field) ? `readings.${group}.${err.field}` : `readings.${group}`;
    throw validationFailed({ [key]: [err.message] });
  }
}

/** The server's own results for a visit's readings; the client's numbers are never stored as results. */
export function computeVisitResults(readings: ReadingsInput, appliance: ApplianceFacts): VisitResults {
  const results: VisitResults = { flags: [] };
  const { combustion, gasInput, thermocouple, gaugeGlassLevel, lowWaterCutoff } = readings;

  if (combustion) {
    results.combustion = run('combustion', combustion, () =>
      analyzeCombustion({
        fuel: appliance.fuel,
        o2Pct: combustion.o2Pct,
        coPpm: combustion.coPpm,
        flueTempF: combustion.flueTempF,
        airTempF: combustion.airTempF,
        draftInWc: orUndefined(combustion.draftInWc),
        ambientCoPpm: orUndefined(combustion.ambientCoPpm),
        spillageSeconds: orUndefined(combustion.spillageSeconds),
        ventType: appliance.ventType,
        condensing: appliance.construction === 'condensing',
      }),
    );
    results.flags.push(...results.combustion.flags);
  }
  if (gasInput) {
    const clocked = run('gasInput', gasInput, () => clockGasInput(gasInput));
    results.gasInput = clocked;
    if (appliance.inputBtuh) {
      const rating = compareInputToRating({
        measuredBtuPerHour: clocked.inputBtuPerHour,
        ratedBtuPerHour: appliance.inputBtuh,
        // No company tolerance: only over-firing is judged.
        underFiringTolerancePct: appliance.underFiringTolerancePct ?? 100,
      });
      results.gasInput = { ...clocked, rating };
      const flag = gasInputRatingFlag(rating, appliance.inputBtuh, appliance.underFiringTolerancePct ?? null);
      if (flag) results.flags.push(flag);
    }
  }
  if (thermocouple && (isNumber(thermocouple.openCircuitMv) || isNumber(thermocouple.closedCircuitMv))) {
    results.thermocouple = run('thermocouple', thermocouple, () =>
      assessThermocoupleMillivolts({ openCircuitMv: orUndefined(thermocouple.openCircuitMv), closedCircuitMv: orUndefined(thermocouple.closedCircuitMv) }),
    );
  }
  if (gaugeGlassLevel) {
    results.gaugeGlass = run('gaugeGlassLevel', 'level', () => assessGaugeGlassLevel(parseGaugeGlassLevel(gaugeGlassLevel)));
    results.flags.push(...results.gaugeGlass.flags);
  }
  if (lowWaterCutoff) {
    results.lowWaterCutoff = { type: lowWaterCutoff.type, passed: lowWaterCutoff.burnerStopped };
    if (!lowWaterCutoff.burnerStopped) results.flags.push(LOW_WATER_CUTOFF_FAILED);
  }
  return results;
}

const isNumber = (v: unknown): v is number => typeof v === 'number';

/** An outcome must be chosen when the low-water cutoff failed or any result says stop. */
export function isOutcomeRequired(results: Partial<VisitResults>): boolean {
  return results.lowWaterCutoff?.passed === false || (results.flags ?? []).some((f) => f.severity === 'stop');
}

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
  if (results.gaugeGlass) out.gaugeGlassFraction = round(results.gaugeGlass.fraction, 3);
  if (isNumber(readings.steamOperatingPsi)) out.steamOperatingPsi = readings.steamOperatingPsi;
  if (isNumber(readings.fillPressurePsi)) out.fillPressurePsi = readings.fillPressurePsi;
  return Object.keys(out).length ? out : null;
}

const round = (v: number, digits: number) => Number(v.toFixed(digits));

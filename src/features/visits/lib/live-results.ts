import {
  analyzeCombustion,
  assessGaugeGlassLevel,
  assessThermocoupleMillivolts,
  clockGasInput,
  compareInputToRating,
  gasInputRatingFlag,
  parseGaugeGlassLevel,
  TradeInputError,
  type CombustionAnalysis,
  type GaugeGlassAssessment,
  type RatingComparison,
  type ThermocoupleAssessment,
  type TradeFlag,
} from '@shared/trade/index';
import type { ApplianceDto } from '@shared/schemas/records';
import type { LocalReadings } from '../draft/draft-fields';

type Result<T> = { ok: true; value: T } | { ok: false; field: string; message: string } | null;

function attempt<T>(compute: () => T): Result<T> {
  try {
    return { ok: true, value: compute() };
  } catch (e) {
    if (e instanceof TradeInputError) return { ok: false, field: e.field, message: e.message.replace(`${e.field}: `, '') };
    throw e;
  }
}

const num = (v: number | null | undefined) => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

export type LiveResults = {
  combustion: Result<CombustionAnalysis>;
  gasInput: Result<{ cubicFeetPerHour: number; inputBtuPerHour: number; rating: RatingComparison | null }>;
  thermocouple: Result<ThermocoupleAssessment>;
  gaugeGlass: Result<GaugeGlassAssessment>;
  lwcoFailed: boolean;
  /** Every flag the readings raise as typed, as the server's results would list them. */
  flags: TradeFlag[];
  stopFlags: TradeFlag[];
};

/** The same shared/trade functions the server runs, computed here as the technician types. */
export function computeLiveResults(r: LocalReadings, a: ApplianceDto | undefined, underFiringTolerancePct: number | null = null): LiveResults {
  const c = r.combustion;
  const o2 = num(c?.o2Pct), co = num(c?.coPpm), flue = num(c?.flueTempF), air = num(c?.airTempF);
  const combustion =
    a && o2 !== undefined && co !== undefined && flue !== undefined && air !== undefined
      ? attempt(() =>
          analyzeCombustion({
            fuel: a.fuel,
            o2Pct: o2,
            coPpm: co,
            flueTempF: flue,
            airTempF: air,
            draftInWc: num(c?.draftInWc),
            ambientCoPpm: num(c?.ambientCoPpm),
            spillageSeconds: num(c?.spillageSeconds),
            ventType: a.ventType,
            condensing: a.construction === 'condensing',
          }),
        )
      : null;

  const g = r.gasInput;
  const dial = num(g?.dialCubicFeet), secs = num(g?.secondsPerRevolution), hv = num(g?.heatingValueBtuPerCubicFoot);
  const gasInput =
    dial !== undefined && secs !== undefined && hv !== undefined
      ? attempt(() => {
          const clocked = clockGasInput({ dialCubicFeet: dial, secondsPerRevolution: secs, heatingValueBtuPerCubicFoot: hv });
          // Without a company tolerance only over-firing is judged; the server applies the same rule.
          const rating = a?.inputBtuh
            ? compareInputToRating({ measuredBtuPerHour: clocked.inputBtuPerHour, ratedBtuPerHour: a.inputBtuh, underFiringTolerancePct: underFiringTolerancePct ?? 100 })
            : null;
          return { ...clocked, rating };
        })
      : null;

  const t = r.thermocouple;
  const open = num(t?.openCircuitMv), closed = num(t?.closedCircuitMv);
  const thermocouple = open !== undefined || closed !== undefined ? attempt(() => assessThermocoupleMillivolts({ openCircuitMv: open, closedCircuitMv: closed })) : null;

  const level = r.gaugeGlassLevel?.trim();
  const gaugeGlass = level ? attempt(() => assessGaugeGlassLevel(parseGaugeGlassLevel(level))) : null;

  const lwcoFailed = r.lowWaterCutoff?.burnerStopped === false;
  const rating = gasInput?.ok && gasInput.value.rating && a?.inputBtuh ? gasInputRatingFlag(gasInput.value.rating, a.inputBtuh, underFiringTolerancePct) : null;
  const flags = [...(combustion?.ok ? combustion.value.flags : []), ...(rating ? [rating] : []), ...(gaugeGlass?.ok ? gaugeGlass.value.flags : [])];
  const stopFlags = flags.filter((f) => f.severity === 'stop');
  return { combustion, gasInput, thermocouple, gaugeGlass, lwcoFailed, flags, stopFlags };
}

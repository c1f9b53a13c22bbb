import type { ApplianceKind, Construction, Fuel, VentType } from '../schemas/enums';
import type { ReadingsInput } from '../schemas/visits';
import {
  analyzeCombustion,
  assessGaugeGlassReading,
  assessLowWaterCutoff,
  assessThermocoupleMillivolts,
  clockGasInput,
  compareInputToRating,
  gasInputRatingFlag,
  LOW_WATER_CUTOFF_FAILED,
  parseGaugeGlassReading,
  thermocoupleFlags,
  oilFiringRate,
  smokeNumberFlags,
  type OilFiringRate,
  TradeInputError,
  type CutoffTripPosition,
  type CombustionAnalysis,
  type GaugeGlassAssessment,
  type RatingComparison,
  type ThermocoupleAssessment,
  type TradeFlag,
} from '../trade/index';

/**
 * One rule for what a visit's readings mean: which results they give, which flags they raise (each flag names its
 * source) and whether an outcome must be chosen. The server stores this on every draft save and completion; the
 * visit editor runs the same function as the technician types, so the phone shows what the server will store.
 */

/** What the computations need to know about the appliance and the company: plain data, read by the caller. */
export type ResultFacts = {
  fuel: Fuel;
  ventType: VentType;
  construction: Construction;
  /** Nameplate input rating, Btu/h; without it the clocked input is not compared. */
  inputBtuh?: number | null;
  /** The company's under-firing tolerance; without it only over-firing is judged. */
  underFiringTolerancePct?: number | null;
  /** Chooses the air-free CO limit by appliance standard; without it the heating-equipment limit applies. */
  kind?: ApplianceKind | null;
  /** The site's elevation, ft; the nameplate is derated for altitude before the clocked input is judged. */
  elevationFt?: number | null;
};

type Loose<T> = T extends object ? { [K in keyof T]?: T[K] | null } : T;
/** Readings as stored (validated) or as typed so far on the phone (a block may be half filled). */
export type ReadingsSoFar = { [K in keyof ReadingsInput]?: Loose<NonNullable<ReadingsInput[K]>> | null };

/** Oil burner: the firing rate from the nozzle and pump pressure, beside the nameplate input; the smoke judgement. */
export type OilResult = { firingRate?: OilFiringRate & { nameplateBtuPerHour: number | null }; smokeFlags: TradeFlag[] };

export type GasInputResult = { cubicFeetPerHour: number; inputBtuPerHour: number; rating?: RatingComparison };

/** A computation's refusal, keyed like the form and the server's details (`readings.<group>.<field>` or `readings.<group>`). */
export type Refusal = { ok: false; key: string; field: string; message: string };
export type Computed<T> = { ok: true; value: T } | Refusal | null;

export type ReadingResults = {
  combustion: Computed<CombustionAnalysis>;
  gasInput: Computed<GasInputResult>;
  thermocouple: Computed<ThermocoupleAssessment>;
  gaugeGlass: Computed<GaugeGlassAssessment>;
  oil: Computed<OilResult>;
  lowWaterCutoff: LowWaterCutoffResult | null;
  lowWaterCutoffFailed: boolean;
  /** Every flag the readings raise, in the order they are stored. */
  flags: TradeFlag[];
  stopFlags: TradeFlag[];
  outcomeRequired: boolean;
};

/** The results as stored on the visit row (`visits.results`). */
export type VisitResults = {
  combustion?: CombustionAnalysis;
  gasInput?: GasInputResult;
  thermocouple?: ThermocoupleAssessment;
  gaugeGlass?: GaugeGlassAssessment;
  oil?: OilResult;
  lowWaterCutoff?: LowWaterCutoffResult;
  /** Every flag from the computations above, in one list, so the form can show them together. */
  flags: TradeFlag[];
};

/** A cutoff test as stored: passed only when the burner stopped with water still visible in the glass. */
export type LowWaterCutoffResult = { type: 'float' | 'probe'; passed: boolean; trippedWith?: CutoffTripPosition | null };

export { LOW_WATER_CUTOFF_FAILED };

const num = (v: number | null | undefined) => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

function attempt<T>(group: string, block: unknown, compute: () => T): Computed<T> {
  try {
    return { ok: true, value: compute() };
  } catch (e) {
    if (!(e instanceof TradeInputError)) throw e;
    const own = block !== null && typeof block === 'object' && Object.hasOwn(block, e.field);
    return { ok: false, key: own ? `readings.${group}.${e.field}` : `readings.${group}`, field: e.field, message: e.message.replace(`${e.field}: `, '') };
  }
}

/** An outcome must be chosen when the low-water cutoff failed or any result says stop. */
export function isOutcomeRequired(results: Partial<Pick<VisitResults, 'flags' | 'lowWaterCutoff'>>): boolean {
  return results.lowWaterCutoff?.passed === false || (results.flags ?? []).some((f) => f.severity === 'stop');
}

/** What the readings give for this appliance. `facts` is undefined while the appliance is not known yet. */
export function computeReadingResults(r: ReadingsSoFar, facts: ResultFacts | undefined): ReadingResults {
  const c = r.combustion;
  const o2 = num(c?.o2Pct), co = num(c?.coPpm), flue = num(c?.flueTempF), air = num(c?.airTempF);
  const combustion: Computed<CombustionAnalysis> =
    facts && o2 !== undefined && co !== undefined && flue !== undefined && air !== undefined
      ? attempt('combustion', c, () =>
          analyzeCombustion({
            fuel: facts.fuel,
            o2Pct: o2,
            coPpm: co,
            flueTempF: flue,
            airTempF: air,
            draftInWc: num(c?.draftInWc),
            ambientCoPpm: num(c?.ambientCoPpm),
            spillageSeconds: num(c?.spillageSeconds),
            outdoorTempF: num(c?.outdoorTempF),
            ventType: facts.ventType,
            condensing: facts.construction === 'condensing',
            applianceKind: facts.kind ?? undefined,
          }),
        )
      : null;

  const g = r.gasInput;
  const dial = num(g?.dialCubicFeet), secs = num(g?.secondsPerRevolution), hv = num(g?.heatingValueBtuPerCubicFoot);
  let ratingFlag: TradeFlag | null = null;
  const gasInput: Computed<GasInputResult> =
    dial !== undefined && secs !== undefined && hv !== undefined
      ? attempt('gasInput', g, () => {
          const clocked: GasInputResult = clockGasInput({ dialCubicFeet: dial, secondsPerRevolution: secs, heatingValueBtuPerCubicFoot: hv });
          if (!facts?.inputBtuh) return clocked;
          const tolerancePct = facts.underFiringTolerancePct ?? null;
          // No company tolerance: only over-firing is judged.
          const rating = compareInputToRating({ measuredBtuPerHour: clocked.inputBtuPerHour, ratedBtuPerHour: facts.inputBtuh, underFiringTolerancePct: tolerancePct ?? 100, elevationFt: num(facts.elevationFt) });
          ratingFlag = gasInputRatingFlag(rating, facts.inputBtuh, tolerancePct);
          return { ...clocked, rating };
        })
      : null;

  const t = r.thermocouple;
  const open = num(t?.openCircuitMv), closed = num(t?.closedCircuitMv);
  const thermocouple =
    open !== undefined || closed !== undefined ? attempt('thermocouple', t, () => assessThermocoupleMillivolts({ openCircuitMv: open, closedCircuitMv: closed })) : null;

  const level = r.gaugeGlassLevel?.trim();
  const gaugeGlass = level ? attempt('gaugeGlassLevel', level, () => assessGaugeGlassReading(parseGaugeGlassReading(level))) : null;

  const o = r.oil;
  const smoke = num(o?.smokeSpot), nozzle = num(o?.nozzleGph), pump = num(o?.pumpPressurePsi);
  const oil: Computed<OilResult> =
    smoke !== undefined || (nozzle !== undefined && pump !== undefined)
      ? attempt('oil', o, () => ({
          smokeFlags: smoke === undefined ? [] : smokeNumberFlags({ smokeNumber: smoke, burnerType: o?.burnerType ?? undefined }, 'smokeSpot'),
          ...(nozzle !== undefined && pump !== undefined
            ? { firingRate: { ...oilFiringRate({ nozzleGph: nozzle, pumpPressurePsi: pump }), nameplateBtuPerHour: facts?.inputBtuh ?? null } }
            : {}),
        }))
      : null;

  const w = r.lowWaterCutoff;
  // A failed test is a stop on the phone even before the cutoff's type is chosen.
  const cutoff = typeof w?.burnerStopped === 'boolean' ? assessLowWaterCutoff({ burnerStopped: w.burnerStopped, trippedWith: w.trippedWith }) : null;
  const lowWaterCutoffFailed = cutoff?.passed === false;
  const lowWaterCutoff = w?.type && cutoff ? { type: w.type, passed: cutoff.passed, trippedWith: cutoff.trippedWith } : null;

  const flags = [
    ...(combustion?.ok ? combustion.value.flags : []),
    ...(ratingFlag ? [ratingFlag] : []),
    ...(thermocouple?.ok ? thermocoupleFlags(thermocouple.value, open ?? null) : []),
    ...(gaugeGlass?.ok ? gaugeGlass.value.flags : []),
    ...(oil?.ok ? oil.value.smokeFlags : []),
    ...(cutoff?.flags ?? []),
  ];
  const stopFlags = flags.filter((f) => f.severity === 'stop');
  const outcomeRequired = lowWaterCutoffFailed || stopFlags.length > 0;
  return { combustion, gasInput, thermocouple, gaugeGlass, oil, lowWaterCutoff, lowWaterCutoffFailed, flags, stopFlags, outcomeRequired };
}

/** The computations' refusals, first one first (the order the form shows the blocks). */
export function refusalsOf(results: ReadingResults): Refusal[] {
  return [results.combustion, results.gasInput, results.thermocouple, results.gaugeGlass, results.oil].filter((x): x is Refusal => x !== null && !x.ok);
}

/** The stored shape of the results: only what was computed. */
export function storedResults(results: ReadingResults): VisitResults {
  const out: VisitResults = { flags: results.flags };
  if (results.combustion?.ok) out.combustion = results.combustion.value;
  if (results.gasInput?.ok) out.gasInput = results.gasInput.value;
  if (results.thermocouple?.ok) out.thermocouple = results.thermocouple.value;
  if (results.gaugeGlass?.ok) out.gaugeGlass = results.gaugeGlass.value;
  if (results.oil?.ok) out.oil = results.oil.value;
  if (results.lowWaterCutoff) out.lowWaterCutoff = results.lowWaterCutoff;
  return out;
}

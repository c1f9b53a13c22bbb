import type { CheckMark, VisitOutcome } from '@shared/schemas/enums';
import { analyzeCombustion, assessThermocoupleMillivolts, clockGasInput, parseGaugeGlassReading, TradeInputError } from '@shared/trade/index';
import type { ReadingsSoFar } from '@shared/visits/visit-results';
import { readingsInput, type ReadingSkips, type ReadingsInput, type VisitDraftInput, type VisitDto } from '@shared/schemas/visits';

/** Readings as typed so far: sub-objects may be incomplete; only complete, valid parts are sent. */
export type LocalReadings = ReadingsSoFar;
export type ReadingKey = keyof ReadingsInput;

export type ChecklistEntry = { key: string; mark: CheckMark | null; note: string };

/** Everything the technician edits on a draft visit. */
export type DraftFields = {
  checklist: ChecklistEntry[];
  readings: LocalReadings;
  /** Required readings not taken, with the reason typed so far. */
  readingSkips: ReadingSkips;
  findings: string;
  recommendations: string;
  internalNotes: string;
  customerAckName: string;
  outcome: VisitOutcome | null;
  outcomeReason: string;
  outcomeToldWhom: string;
  outcomeToldAt: string | null;
};

const TEXT_FIELDS = ['findings', 'recommendations', 'internalNotes', 'customerAckName', 'outcome', 'outcomeReason', 'outcomeToldWhom', 'outcomeToldAt', 'readingSkips'] as const;

export function fieldsFromVisit(v: VisitDto): DraftFields {
  return {
    checklist: v.checklist.map((c) => ({ key: c.key, mark: c.mark, note: c.note ?? '' })),
    readings: (v.readings ?? {}) as LocalReadings,
    readingSkips: v.readingSkips ?? {},
    findings: v.findings ?? '',
    recommendations: v.recommendations ?? '',
    internalNotes: v.internalNotes ?? '',
    customerAckName: v.customerAckName ?? '',
    outcome: v.outcome,
    outcomeReason: v.outcomeReason ?? '',
    outcomeToldWhom: v.outcomeToldWhom ?? '',
    outcomeToldAt: v.outcomeToldAt,
  };
}

const READING_SHAPE = readingsInput.shape;

const orUndefined = <T,>(v: T | null | undefined) => (v === null ? undefined : v);

/** Inputs the server's trade computations would refuse (flue below air, an unreadable gauge level): kept here, not sent. */
function tradeAccepts(key: string, value: Record<string, unknown> | string): boolean {
  try {
    if (key === 'gaugeGlassLevel') parseGaugeGlassReading(value as string);
    if (key === 'combustion') {
      const c = value as NonNullable<ReadingsInput['combustion']>;
      // The fuel does not change which inputs are acceptable; only the refusal matters here.
      analyzeCombustion({ fuel: 'natural_gas', o2Pct: c.o2Pct, coPpm: c.coPpm, flueTempF: c.flueTempF, airTempF: c.airTempF, draftInWc: orUndefined(c.draftInWc), ambientCoPpm: orUndefined(c.ambientCoPpm), spillageSeconds: orUndefined(c.spillageSeconds) });
    }
    if (key === 'gasInput') clockGasInput(value as NonNullable<ReadingsInput['gasInput']>);
    if (key === 'thermocouple') {
      const t = value as NonNullable<ReadingsInput['thermocouple']>;
      assessThermocoupleMillivolts({ openCircuitMv: orUndefined(t.openCircuitMv), closedCircuitMv: orUndefined(t.closedCircuitMv) });
    }
    return true;
  } catch (e) {
    if (e instanceof TradeInputError) return false;
    throw e;
  }
}

/**
 * The readings to send: each block that passes the server's schema and trade checks, and null for a block that is
 * cleared or not yet complete (the server keeps blocks that are not sent). Unfinished blocks stay on this phone.
 */
export function sendableReadings(readings: LocalReadings): ReadingsInput {
  const out: Record<string, unknown> = {};
  for (const key of Object.keys(readings).sort()) {
    const value = readings[key as ReadingKey];
    const schema = READING_SHAPE[key as ReadingKey];
    if (!schema || value === undefined) continue;
    const cleaned =
      value !== null && typeof value === 'object' ? Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined && v !== null && v !== '')) : value;
    const empty = cleaned === null || cleaned === '' || (typeof cleaned === 'object' && Object.keys(cleaned).length === 0);
    const parsed = empty ? null : schema.safeParse(cleaned);
    out[key] = parsed?.success && parsed.data != null && tradeAccepts(key, parsed.data as Record<string, unknown> | string) ? parsed.data : null;
  }
  return out as ReadingsInput;
}

export type FieldErrors = Record<string, string[]>;

/** Messages for readings that were typed but are out of range; a field not yet filled is not an error. */
export function readingErrors(readings: LocalReadings): FieldErrors {
  const errors: FieldErrors = {};
  for (const [key, value] of Object.entries(readings)) {
    const schema = READING_SHAPE[key as ReadingKey];
    if (!schema || value === undefined || value === null) continue;
    const parsed = schema.safeParse(value);
    if (parsed.success) continue;
    for (const issue of parsed.error.issues) {
      let at: unknown = value;
      for (const p of issue.path) at = at !== null && typeof at === 'object' ? (at as Record<PropertyKey, unknown>)[p as PropertyKey] : undefined;
      if (at === undefined || at === null) continue;
      const path = ['readings', key, ...issue.path.map(String)].join('.');
      (errors[path] ??= []).push(issue.message);
    }
  }
  return errors;
}

const blankToNull = (s: string) => (s.trim() === '' ? null : s);

export function toPayload(f: DraftFields, revision: number): VisitDraftInput {
  return {
    revision,
    checklist: f.checklist,
    readings: sendableReadings(f.readings),
    readingSkips: f.readingSkips ?? {},
    findings: f.findings,
    recommendations: f.recommendations,
    internalNotes: f.internalNotes,
    customerAckName: blankToNull(f.customerAckName),
    outcome: f.outcome,
    outcomeReason: blankToNull(f.outcomeReason),
    outcomeToldWhom: blankToNull(f.outcomeToldWhom),
    // "When they were told" belongs with "who was told": a shut-down, or a warning left operating.
    outcomeToldAt: f.outcomeToldWhom.trim() || f.outcome === 'shut_down_unsafe' ? f.outcomeToldAt : null,
  };
}

/** What would be sent, without the revision: equal keys mean the same state, so no second PUT. */
export const payloadKey = (f: DraftFields) => JSON.stringify(toPayload(f, 0));

const same = (a: unknown, b: unknown) => JSON.stringify(a ?? null) === JSON.stringify(b ?? null);

/**
 * Three-way merge after the server moved on: take the server's fresh state and put back every field this phone
 * changed since `base` (the last server state it saw). Checklist items merge by key, readings by block.
 */
export function rebase(base: DraftFields, local: DraftFields, server: DraftFields): DraftFields {
  const merged: DraftFields = { ...server, readings: { ...server.readings } };
  for (const k of TEXT_FIELDS) if (!same(local[k], base[k])) (merged as Record<string, unknown>)[k] = local[k];
  const baseItems = new Map(base.checklist.map((c) => [c.key, c]));
  const localItems = new Map(local.checklist.map((c) => [c.key, c]));
  merged.checklist = server.checklist.map((s) => {
    const l = localItems.get(s.key);
    return l && !same(l, baseItems.get(s.key)) ? l : s;
  });
  const keys = new Set([...Object.keys(local.readings), ...Object.keys(base.readings)]) as Set<ReadingKey>;
  const readings = merged.readings as Record<string, unknown>;
  for (const k of keys) {
    if (same(local.readings[k], base.readings[k])) continue;
    if (local.readings[k] === undefined) delete readings[k];
    else readings[k] = local.readings[k];
  }
  return merged;
}

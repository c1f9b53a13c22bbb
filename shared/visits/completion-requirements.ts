import type { CheckMark, Construction, VisitOutcome, VisitType } from '../schemas/enums';
import { LABELS } from '../schemas/enums';
import { readingsInput, type ReadingKey } from '../schemas/visits';
import type { TradeFlag } from '../trade/trade-flag';
import { FIRED_ONLY_READINGS, READING_LABELS } from './reading-labels';

/**
 * What a visit must hold before it is signed off. One rule for both sides: the server refuses a completion with
 * these as field errors, and the visit editor shows the same list at its "Complete visit" button as it is filled in.
 */
export type CompletionFacts = {
  type: VisitType;
  checklist: readonly { key: string; label: string; mark: CheckMark | null }[];
  /** Readings as stored, or as typed so far on the phone (a block may be half filled). */
  readings: Readonly<Record<string, unknown>>;
  readingSkips: Readonly<Record<string, string | null | undefined>>;
  /** The readings the checklist template requires on this type of visit. */
  requiredReadings: readonly string[];
  /** Every flag the results raised; warnings and stops need an outcome and a note of what the occupant was told. */
  flags: readonly Pick<TradeFlag, 'severity' | 'message'>[];
  lowWaterCutoffFailed: boolean;
  outcome: VisitOutcome | null;
  outcomeReason: string | null;
  outcomeToldWhom: string | null;
  appliance: { construction: Construction } | null | undefined;
  /** Reading errors the caller already knows of (text that is not a number, a computation's refusal), keyed by field path. */
  readingErrors?: Readonly<Record<string, readonly string[]>>;
};

/** One missing or wrong thing: `field` is the path the server's details use ("checklist.gauge_glass", "readings.combustion"). */
export type Requirement = { field: string; label: string; message: string };

const blank = (v: string | null | undefined) => !v || v.trim() === '';

/** "Test the low-water cutoff for its type. Float type: …" → "Test the low-water cutoff for its type". */
export const shortLabel = (label: string) => label.split(/[.;:]/)[0].trim();

const READING_SHAPE = readingsInput.shape;

/** A block with nothing typed in it counts as not taken; empty strings and nulls are nothing typed. */
function filledPart(value: unknown): unknown {
  if (value === null || value === undefined) return null;
  if (typeof value === 'string') return value.trim() === '' ? null : value;
  if (typeof value !== 'object') return value;
  const kept = Object.entries(value).filter(([, v]) => v !== null && v !== undefined && v !== '');
  return kept.length ? Object.fromEntries(kept) : null;
}

function readingRequirements(f: CompletionFacts): Requirement[] {
  const out: Requirement[] = [];
  const seen = new Set<string>();
  const add = (r: Requirement) => {
    const id = `${r.field}\n${r.message}`;
    if (!seen.has(id)) out.push(r);
    seen.add(id);
  };
  const taken = new Set<string>();

  for (const key of Object.keys(READING_SHAPE) as ReadingKey[]) {
    const value = filledPart(f.readings[key]);
    if (value === null) continue;
    taken.add(key);
    const parsed = READING_SHAPE[key].safeParse(value);
    if (parsed.success) continue;
    for (const issue of parsed.error.issues) {
      add({ field: ['readings', key, ...issue.path.map(String)].join('.'), label: READING_LABELS[key], message: issue.message });
    }
  }
  for (const [field, messages] of Object.entries(f.readingErrors ?? {})) {
    const key = field.split('.')[1] as ReadingKey;
    for (const message of messages) add({ field, label: READING_LABELS[key] ?? field, message });
  }

  // A cutoff passes only with water still visible in the glass, so a test without that is not finished.
  const cutoff = f.readings.lowWaterCutoff as { burnerStopped?: unknown; trippedWith?: unknown } | null | undefined;
  if (cutoff?.burnerStopped === true && (cutoff.trippedWith === null || cutoff.trippedWith === undefined)) {
    add({
      field: 'readings.lowWaterCutoff.trippedWith',
      label: READING_LABELS.lowWaterCutoff,
      message: 'Say whether water was still visible in the glass when the cutoff stopped the burner.',
    });
  }

  const fired = f.appliance?.construction !== 'electric';
  for (const key of f.requiredReadings as ReadingKey[]) {
    if (!Object.hasOwn(READING_LABELS, key) || taken.has(key)) continue;
    if (!fired && FIRED_ONLY_READINGS.includes(key)) continue;
    const label = READING_LABELS[key];
    const skip = f.readingSkips[key];
    if (skip === undefined || skip === null) {
      add({
        field: `readings.${key}`,
        label,
        message: `Required on ${LABELS.visitType[f.type].toLowerCase()}: take it, or mark it not taken and say why.`,
      });
    } else if (blank(skip)) {
      add({ field: `readingSkips.${key}`, label, message: `Say why the ${label.toLowerCase()} was not taken.` });
    }
  }
  return out;
}

/** Warnings and stops found on the visit, in words, for the outcome messages. */
export function alertsOf(f: Pick<CompletionFacts, 'flags' | 'lowWaterCutoffFailed'>): string[] {
  const alerts = f.flags.filter((x) => x.severity === 'warning' || x.severity === 'stop').map((x) => x.message);
  if (f.lowWaterCutoffFailed && !alerts.some((m) => /low-water cutoff/i.test(m))) alerts.push('The low-water cutoff did not stop the burner.');
  return alerts;
}

/**
 * The outcome must be chosen; "shut down as unsafe" says why and who was told; and a warning or stop on the visit
 * needs who was told and what they were told, whichever outcome was chosen.
 */
export function outcomeRequirements(
  o: Pick<CompletionFacts, 'outcome' | 'outcomeReason' | 'outcomeToldWhom'>,
  alerts: readonly string[],
  prefix = '',
): Requirement[] {
  const out: Requirement[] = [];
  const warned = alerts.length > 0;
  if (!o.outcome) {
    out.push({
      field: `${prefix}outcome`,
      label: 'Outcome',
      message: warned
        ? 'Choose the outcome: a warning or stop is recorded on this visit, so say whether the appliance was left operating or shut down as unsafe.'
        : 'Choose the outcome: left operating or shut down as unsafe.',
    });
  }
  if (o.outcome === 'shut_down_unsafe' && blank(o.outcomeReason)) {
    out.push({ field: `${prefix}outcomeReason`, label: 'Why it was shut down', message: 'Say why the appliance was shut down.' });
  } else if (warned && blank(o.outcomeReason)) {
    out.push({ field: `${prefix}outcomeReason`, label: 'What the occupant was told', message: 'Say what the occupant was told about the warning.' });
  }
  if (o.outcome === 'shut_down_unsafe' && blank(o.outcomeToldWhom)) {
    out.push({ field: `${prefix}outcomeToldWhom`, label: 'Who was told', message: 'Say who was told it is shut down.' });
  } else if (warned && blank(o.outcomeToldWhom)) {
    out.push({ field: `${prefix}outcomeToldWhom`, label: 'Who was told', message: 'Say who was told about the warning.' });
  }
  return out;
}

/** Everything still missing before the visit can be completed, in the order the visit form shows it. */
export function completionRequirements(f: CompletionFacts): Requirement[] {
  const checklist = f.checklist
    .filter((item) => !item.mark)
    .map((item) => ({ field: `checklist.${item.key}`, label: shortLabel(item.label), message: 'Mark this step: done, not applicable or needs attention.' }));
  return [...checklist, ...readingRequirements(f), ...outcomeRequirements(f, alertsOf(f))];
}

/** The server's `details` shape: messages by field path. */
export function requirementDetails(requirements: readonly Requirement[]): Record<string, string[]> {
  const details: Record<string, string[]> = {};
  for (const r of requirements) (details[r.field] ??= []).push(r.field.startsWith('checklist.') ? `“${r.label}”: ${r.message}` : r.message);
  return details;
}

/**
 * Service visits. Routes (under /api, tenant-filtered):
 *
 *   POST /visits                        VisitDto  visits:record  (starts a draft with its own copy of the checklist)
 *   GET  /visits/:id                    VisitDto  records:read
 *   PUT  /visits/:id/draft              VisitDto  visits:record  (autosave; 409 once completed)
 *   POST /visits/:id/swaps              VisitDto  visits:record  (part swap: old component removed today, new one installed)
 *   POST /visits/:id/complete           VisitDto  visits:record  (400 with details per missing thing: shared/visits/completion-requirements.ts)
 *   POST /visits/:id/amendments         VisitDto  visits:amend-any, or visits:amend-own for the visit's own technician
 *
 * Readings are stored in one canonical unit each (°F, in. w.c., psi, mV, ppm, %); the client converts at the edge.
 * The server recomputes the results from shared/trade and stores its own result.
 */
import type { TransferProvenanceDto } from './record-transfers';
import { z } from 'zod';
import { SWAP_CAUSES } from '../stats/swap-causes';
import * as E from './enums';
import { isoDate, optionalText, storableText } from './common';
import { FLUE_TEMP_PLAUSIBLE_F, FLUE_TEMP_RANGE_MESSAGE, flueBelowAirMessage, isFlueBelowCombustionAir } from '../trade/plausible-readings';
import { describeRange, READING_RANGES, type ReadingName } from '../trade/reading-ranges';
import { CUTOFF_TRIP_POSITIONS } from '../trade/low-water-cutoff';

const n = (label: string, min: number, max: number) =>
  z.number(`${label} must be a number.`).min(min, `${label} must be at least ${min}.`).max(max, `${label} must be at most ${max}.`);

/** A reading the trade computations take: the same range as shared/trade/reading-ranges.ts, named in the message. */
const reading = (label: string, name: ReadingName) => {
  const range: { min?: number; max?: number; minExclusive?: number; maxExclusive?: number } = READING_RANGES[name];
  const message = `${label} must be ${describeRange(READING_RANGES[name])}.`;
  let schema = z.number(`${label} must be a number.`);
  if (range.min !== undefined) schema = schema.min(range.min, message);
  if (range.max !== undefined) schema = schema.max(range.max, message);
  if (range.minExclusive !== undefined) schema = schema.gt(range.minExclusive, message);
  if (range.maxExclusive !== undefined) schema = schema.lt(range.maxExclusive, message);
  return schema;
};

const combustionFields = z.object({
  o2Pct: reading('O2', 'o2Pct'),
  coPpm: reading('CO', 'coPpm'),
  flueTempF: z.number('Flue temperature must be a number.').min(FLUE_TEMP_PLAUSIBLE_F.min, FLUE_TEMP_RANGE_MESSAGE).max(FLUE_TEMP_PLAUSIBLE_F.max, FLUE_TEMP_RANGE_MESSAGE),
  airTempF: reading('Combustion-air temperature', 'airTempF'),
  draftInWc: reading('Draft', 'draftInWc').nullish(),
  ambientCoPpm: reading('Ambient CO', 'ambientCoPpm').nullish(),
  spillageSeconds: reading('Spillage time', 'spillageSeconds').nullish(),
  outdoorTempF: reading('Outdoor temperature', 'outdoorTempF').nullish(),
  steadyFiringMinutes: n('Minutes of steady firing', 0, 240).nullish(),
});

/** Refused as impossible, not just unusual: see shared/trade/plausible-readings.ts. */
const flueInRange = (f: number) => f >= FLUE_TEMP_PLAUSIBLE_F.min && f <= FLUE_TEMP_PLAUSIBLE_F.max;
// An out-of-range flue already has its message; comparing it with the air would only add a second one.
export const combustionReadings = combustionFields.refine((c) => !flueInRange(c.flueTempF) || !isFlueBelowCombustionAir(c.flueTempF, c.airTempF), {
  path: ['flueTempF'],
  error: (issue) => {
    const c = issue.input as { flueTempF: number; airTempF: number };
    return flueBelowAirMessage(c.flueTempF, c.airTempF);
  },
});

export const readingsInput = z
  .object({
    combustion: combustionReadings.nullish(),
    gasInput: z
      .object({
        dialCubicFeet: reading('Meter dial', 'dialCubicFeet'),
        secondsPerRevolution: reading('Seconds per revolution', 'secondsPerRevolution'),
        heatingValueBtuPerCubicFoot: reading('Heating value', 'heatingValueBtuPerCubicFoot'),
      })
      .nullish(),
    thermocouple: z
      .object({ openCircuitMv: reading('Open-circuit mV', 'openCircuitMv').nullish(), closedCircuitMv: reading('Closed-circuit mV', 'closedCircuitMv').nullish() })
      .nullish(),
    gaugeGlassLevel: storableText().trim().max(20).nullish(),
    lowWaterCutoff: z
      .object({
        type: z.enum(['float', 'probe'], 'Say whether the cutoff is a float or a probe type.'),
        trippedAtLevel: storableText().trim().max(20).nullish(),
        /** Where the water stood against the gauge glass when the burner stopped (ASME Section IV: still visible). */
        trippedWith: z.enum(CUTOFF_TRIP_POSITIONS, 'Say whether water was still visible in the glass when the cutoff tripped.').nullish(),
        burnerStopped: z.boolean('Say whether the burner stopped.'),
      })
      .nullish(),
    steamOperatingPsi: n('Operating pressure', 0, 300).nullish(),
    pressureControlCutInPsi: n('Cut-in', 0, 300).nullish(),
    pressureControlCutOutPsi: n('Cut-out', 0, 300).nullish(),
    fillPressurePsi: n('Fill pressure', 0, 300).nullish(),
    expansionTankPrechargePsi: n('Pre-charge', 0, 300).nullish(),
    gasInletInWc: n('Inlet pressure', 0, 50).nullish(),
    gasManifoldInWc: n('Manifold pressure', 0, 50).nullish(),
    oil: z
      .object({
        smokeSpot: reading('Smoke spot', 'smokeNumber').int('Smoke spot must be a whole number on the 0–9 scale.').nullish(),
        pumpPressurePsi: reading('Pump pressure', 'pumpPressurePsi').nullish(),
        nozzleGph: reading('Nozzle rating', 'nozzleGph').nullish(),
        burnerType: z.enum(['flame_retention', 'non_retention'], 'Say whether the burner is flame-retention or an older type.').nullish(),
        overFireDraftInWc: n('Over-fire draft', -2, 2).nullish(),
        breechDraftInWc: n('Breech draft', -2, 2).nullish(),
      })
      .nullish(),
    makeupWater: z.object({ meterGallons: n('Feeder meter', 0, 1_000_000).nullish(), addedByHandGallons: n('Water added', 0, 1000).nullish() }).nullish(),
  })
  .strict();
export type ReadingsInput = z.infer<typeof readingsInput>;
export type ReadingKey = keyof ReadingsInput;
export const READING_KEYS = Object.keys(readingsInput.shape) as [ReadingKey, ...ReadingKey[]];

/** Required readings not taken, each with the reason ('' until one is typed; completing then asks for it). */
export const readingSkipsInput = z.partialRecord(z.enum(READING_KEYS, 'Not a reading of this form.'), storableText().trim().max(500, 'At most 500 characters.'));
export type ReadingSkips = z.infer<typeof readingSkipsInput>;

export const checklistEntryInput = z.object({
  key: storableText().max(60),
  mark: z.enum(E.CHECK_MARKS).nullable(),
  note: storableText().max(2000).default(''),
});

export const visitStartInput = z.object({
  /** Chosen by the phone when it starts a visit offline, so its queued edits can name the visit before the server has it. */
  id: z.uuid('Not a valid visit id.').optional(),
  applianceId: z.uuid('Pick an appliance.'),
  type: z.enum(E.VISIT_TYPES, 'Choose the visit type.'),
  visitedOn: isoDate.optional(),
  arrivedAt: z.iso.datetime({ offset: true }).optional(),
  /** The booking this visit is made for (the round's "Start visit"); completing every booked appliance marks it done. */
  bookingId: z.uuid('Not a valid booking id.').optional(),
});

export const outcomeInput = z.object({
  outcome: z.enum(E.VISIT_OUTCOMES).nullish(),
  outcomeReason: optionalText(2000),
  outcomeToldWhom: optionalText(200),
  outcomeToldAt: z.iso.datetime({ offset: true }).nullish(),
});

export const visitDraftInput = z
  .object({
    /** The revision the client last saw; a stale save is refused with 409 so nothing is silently overwritten. */
    revision: z.number().int().min(0),
    checklist: z.array(checklistEntryInput).max(200).optional(),
    readings: readingsInput.optional(),
    /** Replaces the stored skips when sent. */
    readingSkips: readingSkipsInput.optional(),
    findings: storableText().max(8000).optional(),
    recommendations: storableText().max(8000).optional(),
    internalNotes: storableText().max(8000).optional(),
    technicianIds: z.array(z.uuid()).max(10).optional(),
    departedAt: z.iso.datetime({ offset: true }).nullish(),
    customerAckName: optionalText(160),
  })
  .extend(outcomeInput.shape);
export type VisitDraftInput = z.input<typeof visitDraftInput>;

export const visitCompleteInput = visitDraftInput;

export const swapInput = z.object({
  componentId: z.uuid('Pick the part that was replaced.'),
  reason: optionalText(500),
  cause: z.enum(SWAP_CAUSES, 'Say why the old part came out.').default('wear_or_failure'),
  newDescription: optionalText(200),
  newSpec: z.record(storableText(), z.union([storableText().max(60), z.number()])).optional(),
  swappedOn: isoDate.optional(),
});

export const amendmentInput = z.object({
  reason: storableText().trim().min(3, 'Say why the visit is being corrected.').max(2000),
  findings: storableText().max(8000).optional(),
  recommendations: storableText().max(8000).optional(),
  checklist: z.array(checklistEntryInput).max(200).optional(),
  readings: readingsInput.optional(),
  outcome: outcomeInput.optional(),
  /** Corrections to part swaps recorded on this visit; the components' dates follow. */
  swaps: z.array(z.object({ swapId: z.uuid(), swappedOn: isoDate, reason: optionalText(500) })).max(20).optional(),
});

export type ChecklistItemDto = { key: string; section: string; label: string; caution?: string; readings?: string[]; mark: E.CheckMark | null; note: string };

export type VisitDto = {
  id: string;
  applianceId: string;
  type: E.VisitType;
  status: E.VisitStatus;
  visitedOn: string;
  technicians: { id: string; name: string }[];
  arrivedAt: string | null;
  departedAt: string | null;
  checklist: ChecklistItemDto[];
  readings: ReadingsInput;
  /** Readings the checklist template requires on this type of visit, copied when the visit started. */
  requiredReadings: ReadingKey[];
  readingSkips: ReadingSkips;
  /** Computed by the server from shared/trade; never trusted from the client. */
  results: Record<string, unknown>;
  /** True when a failed low-water cutoff test or a stop flag means an outcome must be chosen before completing. */
  outcomeRequired: boolean;
  findings: string;
  recommendations: string;
  internalNotes: string;
  outcome: E.VisitOutcome | null;
  outcomeReason: string | null;
  outcomeToldWhom: string | null;
  outcomeToldAt: string | null;
  signedOffBy: { id: string; name: string } | null;
  signedOffAt: string | null;
  customerAckName: string | null;
  completedAt: string | null;
  revision: number;
  swaps: { id: string; removedComponentId: string; newComponentId: string; typeLabel: string; swappedOn: string; reason: string | null; newDescription: string | null }[];
  amendments: { id: string; reason: string; changes: Record<string, unknown>; createdAt: string; createdByName: string | null }[];
  /** Set on a visit copied from another company's record: recorded by that company, not by anyone here. */
  recordedElsewhere?: TransferProvenanceDto | null;
};

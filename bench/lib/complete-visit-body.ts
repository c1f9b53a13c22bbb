import type { ReadingsInput, VisitDraftInput } from '../../shared/schemas/visits';

/** What the client knows of the visit from its last answer (a VisitDto has these). */
export type VisitForCompletion = { revision: number; checklist: { key: string; readings?: string[] }[] };

/** Readings a sound appliance gives at its annual check, for the reading groups the checklist asks for. */
function readingsFor(wanted: Set<string>): ReadingsInput {
  const readings: ReadingsInput = {};
  // Typical of a gas appliance in good order (O2 7 %, CO 20 ppm air-free about 30 ppm): no flag stops the sign-off.
  // common practice
  if (wanted.has('combustion')) {
    readings.combustion = { o2Pct: 7, coPpm: 20, flueTempF: 400, airTempF: 65, draftInWc: -0.03, ambientCoPpm: 0, spillageSeconds: 5, steadyFiringMinutes: 8 };
  }
  if (wanted.has('lowWaterCutoff')) readings.lowWaterCutoff = { type: 'float', trippedAtLevel: '1/4', trippedWith: 'water_visible', burnerStopped: true };
  if (wanted.has('thermocouple')) readings.thermocouple = { openCircuitMv: 25, closedCircuitMv: 13 };
  if (wanted.has('gaugeGlassLevel')) readings.gaugeGlassLevel = '1/2';
  return readings;
}

/**
 * The body that signs a visit off in full: every checklist step done, the readings its steps ask for, the outcome
 * and who was told. The API, bench and concurrency tests complete visits with it, so a stricter completion rule
 * is met in one place.
 */
export function completeVisitBody(visit: VisitForCompletion, overrides: Partial<VisitDraftInput> = {}): VisitDraftInput {
  const wanted = new Set(visit.checklist.flatMap((item) => item.readings ?? []));
  return {
    revision: visit.revision,
    checklist: visit.checklist.map((item) => ({ key: item.key, mark: 'done', note: '' })),
    readings: readingsFor(wanted),
    findings: 'Checked every item on the list; appliance in good order.',
    outcome: 'left_operating',
    outcomeToldWhom: 'Homeowner, in person',
    outcomeToldAt: new Date().toISOString(),
    customerAckName: 'Homeowner',
    ...overrides,
  };
}

/** A draft save as the visit form autosaves it: a note and one checklist mark, at the visit's current revision. */
export function draftSaveBody(visit: VisitForCompletion, step: number): VisitDraftInput {
  const item = visit.checklist[step % Math.max(visit.checklist.length, 1)];
  return {
    revision: visit.revision,
    findings: `Draft note ${step + 1}.`,
    ...(item ? { checklist: [{ key: item.key, mark: 'done' as const, note: '' }] } : {}),
  };
}

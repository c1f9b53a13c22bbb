import type { Tx } from '../../db/client';
import { LABELS } from '../../../shared/schemas/enums';
import { formatCalendarDate } from '../../../shared/format/dates';
import type { ReadingsInput } from '../../../shared/schemas/visits';
import { componentTypesForChecklistKey } from './checklist-components';
import { keyReadings, type VisitResults } from './visit-results';
import { visitsRepository, type VisitRow } from './visits.repository';
import { appendTimelineEvent } from '../../core/timeline';
import { typeLabelFor } from '../../core/type-label';
import { outcomeInSentence } from '../../../shared/glossary/outcomes';

type Finding = { inspected: boolean; failedNote: string | null };

/**
 * What the visit found about each present part of the appliance: which were inspected (a checklist item about the
 * part marked done or needs attention, or a reading of it) and which failed on condition.
 */
function findingsByType(visit: VisitRow, readings: ReadingsInput, results: VisitResults): Map<string, Finding> {
  const byType = new Map<string, Finding>();
  const note = (type: string, failedNote: string | null) => {
    const f = byType.get(type) ?? { inspected: false, failedNote: null };
    f.inspected = true;
    if (failedNote && !f.failedNote) f.failedNote = failedNote;
    byType.set(type, f);
  };
  for (const item of visit.checklist) {
    if (item.mark !== 'done' && item.mark !== 'needs_attention') continue;
    const failed = item.mark === 'needs_attention' ? item.note.trim() || `${item.label}: needs attention (visit of ${formatCalendarDate(visit.visitedOn)}).` : null;
    for (const type of componentTypesForChecklistKey(item.key)) note(type, failed);
  }
  if (results.thermocouple) {
    note('thermocouple', results.thermocouple.status === 'replace' ? results.thermocouple.reason : null);
  }
  if (readings.gaugeGlassLevel) note('gauge_glass', null);
  if (readings.lowWaterCutoff) note(readings.lowWaterCutoff.type === 'float' ? 'low_water_cutoff_float' : 'low_water_cutoff_probe', null);
  return byType;
}

/** Writes the visit's findings onto the appliance's parts: last inspection date and condition. */
export async function applyFindingsToComponents(tx: Tx, companyId: string, actorId: string, visit: VisitRow, results: VisitResults) {
  const readings = visit.readings as ReadingsInput;
  const findings = findingsByType(visit, readings, results);
  const present = await visitsRepository.presentComponents(tx, companyId, visit.applianceId);
  // A failed finding was about the part that was there before a swap on this visit, not the new one.
  const fittedThisVisit = new Set((await visitsRepository.swapsOfVisit(tx, companyId, visit.id)).map((s) => s.newComponentId));
  for (const c of present) {
    const f = findings.get(c.typeCode);
    if (!f?.inspected) continue;
    const lastInspectedOn = c.lastInspectedOn && c.lastInspectedOn > visit.visitedOn ? c.lastInspectedOn : visit.visitedOn;
    const failedNote = fittedThisVisit.has(c.id) ? null : f.failedNote;
    // The latest inspection decides the condition: a failed finding sets it, a clean one clears an old failure.
    await visitsRepository.updateComponent(tx, companyId, c.id, {
      lastInspectedOn,
      conditionFailed: failedNote !== null,
      conditionNote: failedNote,
      updatedBy: actorId,
    });
  }
}

/** "Annual maintenance: left operating. Replaced: thermocouple (24 in)." */
export function visitSummary(visit: VisitRow, swaps: { typeCode: string; catalogLabel: string | null; newSpecKey: string }[]): string {
  const parts = [`${LABELS.visitType[visit.type]}${visit.outcome ? `: ${outcomeInSentence(visit.outcome)}` : ' completed'}.`];
  if (swaps.length) {
    const replaced = swaps.map((s) => `${typeLabelFor(s.typeCode, s.catalogLabel)}${s.newSpecKey ? ` (${s.newSpecKey})` : ''}`);
    parts.push(`Replaced: ${replaced.join(', ')}.`);
  }
  const attention = visit.checklist.filter((i) => i.mark === 'needs_attention').map((i) => i.label);
  if (attention.length) parts.push(`Needs attention: ${attention.join('; ')}.`);
  return parts.join(' ');
}

function readingSummary(k: Record<string, number>): string {
  const bits: string[] = [];
  if (k.efficiencyPct !== undefined) bits.push(`efficiency ${k.efficiencyPct} %`);
  if (k.coAirFreePpm !== undefined) bits.push(`air-free CO ${k.coAirFreePpm} ppm`);
  if (k.flueTempF !== undefined) bits.push(`flue ${k.flueTempF} °F`);
  if (k.inputBtuPerHour !== undefined) bits.push(`input ${k.inputBtuPerHour.toLocaleString('en-US')} Btu/h`);
  if (k.thermocoupleOpenCircuitMv !== undefined) bits.push(`thermocouple ${k.thermocoupleOpenCircuitMv} mV open circuit`);
  if (k.steamOperatingPsi !== undefined) bits.push(`steam ${k.steamOperatingPsi} psi`);
  return bits.length ? `Readings: ${bits.join(', ')}.` : 'Readings recorded.';
}

/** The 'visit' event, and a 'reading' event with the key results when readings were taken (trend charts read these). */
export async function appendCompletionEvents(tx: Tx, companyId: string, actorId: string, visit: VisitRow, results: VisitResults) {
  const swaps = await visitsRepository.swapsOfVisit(tx, companyId, visit.id);
  const occurredAt = visit.departedAt ?? visit.completedAt ?? new Date();
  await appendTimelineEvent(tx, {
    companyId,
    applianceId: visit.applianceId,
    occurredAt,
    kind: 'visit',
    refId: visit.id,
    summary: visitSummary(visit, swaps),
    data: { visitId: visit.id, type: visit.type, outcome: visit.outcome, visitedOn: visit.visitedOn, swapIds: swaps.map((s) => s.id) },
    actorId,
  });
  const key = keyReadings(visit.readings as ReadingsInput, results);
  if (key) {
    await appendTimelineEvent(tx, {
      companyId,
      applianceId: visit.applianceId,
      occurredAt,
      kind: 'reading',
      refId: visit.id,
      summary: readingSummary(key),
      data: { visitId: visit.id, visitedOn: visit.visitedOn, ...key },
      actorId,
    });
  }
}

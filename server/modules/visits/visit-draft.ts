import type { z } from 'zod';
import type { DbOrTx } from '../../db/client';
import type { ChecklistItemRecord } from '../../db/schema/index';
import { validationFailed } from '../../lib/http-error';
import type { checklistEntryInput, ReadingsInput, visitDraftInput } from '../../../shared/schemas/visits';
import { resultsToStore, type VisitResults } from './visit-results';
import { visitsRepository, type VisitRow } from './visits.repository';

export type DraftFields = z.output<typeof visitDraftInput>;
type ChecklistEntry = z.output<typeof checklistEntryInput>;
type ApplianceFacts = Parameters<typeof resultsToStore>[1];

/** Marks and notes matched by key onto the visit's own copy of the checklist; an unknown key is a field error. */
export function mergeChecklist(current: ChecklistItemRecord[], entries: ChecklistEntry[], path = 'checklist'): ChecklistItemRecord[] {
  const errors: Record<string, string[]> = {};
  const byKey = new Map(entries.map((e, i) => [e.key, { e, i }]));
  entries.forEach((e, i) => {
    if (!current.some((item) => item.key === e.key)) errors[`${path}.${i}.key`] = ['This item is not on the visit’s checklist.'];
  });
  if (Object.keys(errors).length) throw validationFailed(errors);
  return current.map((item) => {
    const found = byKey.get(item.key);
    return found ? { ...item, mark: found.e.mark, note: found.e.note } : item;
  });
}

/** Groups given replace the stored group (null clears it); groups not sent are kept. */
export function mergeReadings(current: Record<string, unknown>, given: ReadingsInput | undefined): ReadingsInput {
  return { ...(current as ReadingsInput), ...(given ?? {}) };
}

/**
 * The visit row after a draft save: given fields merged over the stored ones and the results recomputed by the
 * server. Throws field errors for unknown checklist keys, non-members as technicians and readings the trade
 * computations refuse.
 */
export async function mergeDraft(
  db: DbOrTx,
  companyId: string,
  visit: VisitRow,
  input: DraftFields,
  appliance: ApplianceFacts,
): Promise<{ patch: Partial<VisitRow>; results: VisitResults; changedFields: string[] }> {
  const patch: Partial<VisitRow> = {};
  if (input.checklist) patch.checklist = mergeChecklist(visit.checklist, input.checklist);
  const readings = mergeReadings(visit.readings, input.readings);
  const results = resultsToStore(readings, appliance);
  if (input.readings) patch.readings = readings;
  patch.results = results;

  if (input.technicianIds) {
    const ids = [...new Set(input.technicianIds)];
    const members = await visitsRepository.activeMemberIds(db, companyId, ids);
    const unknown = ids.filter((id) => !members.has(id));
    if (unknown.length) throw validationFailed({ technicianIds: ['Pick technicians from your own team.'] });
    if (ids.length === 0) throw validationFailed({ technicianIds: ['A visit needs at least one technician.'] });
    patch.technicianIds = ids;
  }
  for (const key of ['findings', 'recommendations', 'internalNotes'] as const) {
    if (input[key] !== undefined) patch[key] = input[key];
  }
  if (input.customerAckName !== undefined) patch.customerAckName = input.customerAckName;
  if (input.readingSkips !== undefined) patch.readingSkips = input.readingSkips as Record<string, string>;
  if (input.departedAt !== undefined) patch.departedAt = input.departedAt ? new Date(input.departedAt) : null;
  if (input.outcome !== undefined) patch.outcome = input.outcome;
  if (input.outcomeReason !== undefined) patch.outcomeReason = input.outcomeReason;
  if (input.outcomeToldWhom !== undefined) patch.outcomeToldWhom = input.outcomeToldWhom;
  if (input.outcomeToldAt !== undefined) patch.outcomeToldAt = input.outcomeToldAt ? new Date(input.outcomeToldAt) : null;

  const changedFields = Object.keys(input).filter((k) => k !== 'revision' && input[k as keyof DraftFields] !== undefined);
  return { patch, results, changedFields };
}

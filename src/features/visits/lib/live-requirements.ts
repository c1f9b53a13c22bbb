import type { ApplianceDto } from '@shared/schemas/records';
import type { VisitDto } from '@shared/schemas/visits';
import { completionRequirements, type Requirement } from '@shared/visits/completion-requirements';
import type { DraftFields } from '../draft/draft-fields';
import { refusalsOf, type ReadingResults } from '@shared/visits/visit-results';

export const NOT_A_NUMBER = 'Type a number, like 8.5.';

/**
 * What still stops this visit from being completed, by the same rule the server applies, from what is on the
 * phone now: marks and readings as typed, text in number fields that is not a number, and the live computations.
 */
export function liveRequirements(input: {
  visit: Pick<VisitDto, 'type' | 'checklist' | 'requiredReadings'>;
  fields: DraftFields;
  live: ReadingResults;
  appliance: ApplianceDto | undefined;
  badText: Record<string, string>;
}): Requirement[] {
  const { visit, fields, live, appliance, badText } = input;
  const marks = new Map(fields.checklist.map((c) => [c.key, c.mark]));
  const facts = {
    type: visit.type,
    checklist: visit.checklist.map((item) => ({ key: item.key, label: item.label, mark: marks.get(item.key) ?? null })),
    readings: fields.readings,
    readingSkips: fields.readingSkips ?? {},
    requiredReadings: visit.requiredReadings ?? [],
    flags: live.flags,
    lowWaterCutoffFailed: live.lowWaterCutoffFailed,
    outcome: fields.outcome,
    outcomeReason: fields.outcomeReason,
    outcomeToldWhom: fields.outcomeToldWhom,
    appliance,
    readingErrors: Object.fromEntries(Object.keys(badText).map((path) => [path, [NOT_A_NUMBER]])),
  };
  const first = completionRequirements(facts);
  // A computation's refusal matters only where the schema found nothing wrong with the block already.
  const refused: Record<string, string[]> = {};
  for (const r of refusalsOf(live)) {
    const block = r.key.split('.')[1];
    if (first.some((x) => x.field === `readings.${block}` || x.field.startsWith(`readings.${block}.`))) continue;
    refused[r.key] = [r.message];
  }
  const all = Object.keys(refused).length ? completionRequirements({ ...facts, readingErrors: { ...facts.readingErrors, ...refused } }) : first;
  // Text that is not a number leaves the value empty; "must be a number" beside "type a number" says it twice.
  return all.filter((r) => !(r.field in badText) || r.message === NOT_A_NUMBER);
}

import type { ApplianceDto } from '@shared/schemas/records';
import type { VisitDto } from '@shared/schemas/visits';
import { completionRequirements, type Requirement } from '@shared/visits/completion-requirements';
import type { DraftFields } from '../draft/draft-fields';
import type { LiveResults } from './live-results';

export const NOT_A_NUMBER = 'Type a number, like 8.5.';

/** The block each live computation reads, for keying its refusal like the server would. */
const LIVE_BLOCKS = { combustion: 'combustion', gasInput: 'gasInput', thermocouple: 'thermocouple', gaugeGlass: 'gaugeGlassLevel' } as const;

/**
 * What still stops this visit from being completed, by the same rule the server applies, from what is on the
 * phone now: marks and readings as typed, text in number fields that is not a number, and the live computations.
 */
export function liveRequirements(input: {
  visit: Pick<VisitDto, 'type' | 'checklist' | 'requiredReadings'>;
  fields: DraftFields;
  live: LiveResults;
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
    lowWaterCutoffFailed: live.lwcoFailed,
    outcome: fields.outcome,
    outcomeReason: fields.outcomeReason,
    outcomeToldWhom: fields.outcomeToldWhom,
    appliance,
    readingErrors: Object.fromEntries(Object.keys(badText).map((path) => [path, [NOT_A_NUMBER]])),
  };
  const first = completionRequirements(facts);
  // A computation's refusal matters only where the schema found nothing wrong with the block already.
  const refused: Record<string, string[]> = {};
  for (const [result, key] of Object.entries(LIVE_BLOCKS)) {
    const r = live[result as keyof typeof LIVE_BLOCKS];
    if (!r || r.ok || first.some((x) => x.field === `readings.${key}` || x.field.startsWith(`readings.${key}.`))) continue;
    const block = fields.readings[key];
    // Keyed like the server's results: the block's own field when the refusal names one, else the block.
    const own = block !== null && typeof block === 'object' && Object.hasOwn(block, r.field);
    refused[own ? `readings.${key}.${r.field}` : `readings.${key}`] = [r.message];
  }
  const all = Object.keys(refused).length ? completionRequirements({ ...facts, readingErrors: { ...facts.readingErrors, ...refused } }) : first;
  // Text that is not a number leaves the value empty; "must be a number" beside "type a number" says it twice.
  return all.filter((r) => !(r.field in badText) || r.message === NOT_A_NUMBER);
}

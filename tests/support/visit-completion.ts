import type { ReadingKey, ReadingsInput, VisitDraftInput, VisitDto } from '../../shared/schemas/visits';

/** A clean gas-fired combustion test: 7 % O2, 50 ppm CO, flue 400 °F over 70 °F air (no flags above info). */
export const GOOD_COMBUSTION = { o2Pct: 7, coPpm: 50, flueTempF: 400, airTempF: 70 } as const;

/** Readings that satisfy each requirement a default template can make; no warnings or stops among them. */
const GOOD_READINGS: Partial<ReadingsInput> = {
  combustion: GOOD_COMBUSTION,
  lowWaterCutoff: { type: 'float', trippedAtLevel: '1/4', trippedWith: 'water_visible', burnerStopped: true },
};

type Options = {
  /** Skip every required reading with this reason instead of taking it. */
  skipRequiredWith?: string;
};

/**
 * A body that completes `visit` honestly: every checklist step marked done, the readings its template requires,
 * "left operating". Fields given in `overrides` replace these (readings are merged block by block).
 */
export function fullCompletion(visit: Pick<VisitDto, 'revision' | 'checklist' | 'requiredReadings'>, overrides: Partial<VisitDraftInput> = {}, options: Options = {}): VisitDraftInput {
  const readings: Record<string, unknown> = {};
  const readingSkips: Partial<Record<ReadingKey, string>> = {};
  for (const key of visit.requiredReadings) {
    if (options.skipRequiredWith) {
      readingSkips[key] = options.skipRequiredWith;
      continue;
    }
    if (!GOOD_READINGS[key]) throw new Error(`fullCompletion has no good reading for ${key}; add one`);
    readings[key] = GOOD_READINGS[key];
  }
  return {
    revision: visit.revision,
    checklist: visit.checklist.map((i) => ({ key: i.key, mark: 'done' as const, note: '' })),
    outcome: 'left_operating',
    ...(Object.keys(readingSkips).length ? { readingSkips } : {}),
    ...overrides,
    readings: { ...readings, ...(overrides.readings ?? {}) } as ReadingsInput,
    ...(overrides.checklist ? { checklist: mergeMarks(visit.checklist, overrides.checklist) } : {}),
  };
}

/** The given marks over "done" for every other step. */
function mergeMarks(all: VisitDto['checklist'], given: NonNullable<VisitDraftInput['checklist']>) {
  const byKey = new Map(given.map((g) => [g.key, g]));
  return all.map((i) => byKey.get(i.key) ?? { key: i.key, mark: 'done' as const, note: '' });
}

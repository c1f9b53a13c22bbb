import { z } from 'zod';
import * as E from './enums';
import { storableText } from './common';

/**
 * The life record of one appliance as a portable document (version 1). docs/schemas/life-record-export.v1.json is
 * generated from this schema (z.toJSONSchema) and committed; a test checks the two agree and validates exports
 * against the committed file. A change that breaks readers of version 1 needs a version 2 beside it.
 */
export const LIFE_RECORD_EXPORT_FORMAT = 'lifeplate.life-record';
export const LIFE_RECORD_EXPORT_VERSION = 1;

const text = () => storableText();
const nullableText = () => storableText().nullable();
const date = z.iso.date();
const nullableDate = date.nullable();
const number = () => z.number();
const nullableNumber = () => z.number().nullable();

const reading = z.object({ reading: text(), value: text(), meaning: text() });

export const lifeRecordExportSchema = z
  .object({
    format: z.literal(LIFE_RECORD_EXPORT_FORMAT),
    version: z.literal(LIFE_RECORD_EXPORT_VERSION),
    exportedAt: z.iso.datetime({ offset: true }),
    recordedBy: z.object({ name: text(), phone: text() }).describe('The service company that kept the record.'),
    appliance: z.object({
      kind: z.enum(E.APPLIANCE_KINDS),
      fuel: z.enum(E.FUELS),
      construction: z.enum(E.CONSTRUCTIONS),
      manufacturer: nullableText(),
      model: nullableText(),
      serial: nullableText().describe('Left out (null) in exports made from a share link.'),
      manufacturedYear: nullableNumber(),
      manufacturedMonth: nullableNumber(),
      installedOn: nullableDate,
      ageYears: nullableNumber(),
      location: nullableText(),
      address: text(),
      status: z.enum(E.APPLIANCE_STATUSES),
      inputBtuPerHour: nullableNumber(),
      grossOutputBtuPerHour: nullableNumber(),
      firingRateGallonsPerHour: nullableNumber(),
      maxWorkingPressurePsi: nullableNumber(),
      ignitionType: z.enum(E.IGNITION_TYPES),
      ventType: z.enum(E.VENT_TYPES),
    }),
    components: z.array(
      z.object({
        typeCode: text(),
        typeLabel: text(),
        description: nullableText(),
        spec: z.record(text(), z.union([text(), number()])),
        installedOn: nullableDate,
        originalWithAppliance: z.boolean(),
        ageYears: nullableNumber(),
        lastInspectedOn: nullableDate,
        conditionFailed: z.boolean(),
        removedOn: nullableDate,
        removalReason: nullableText(),
        due: z.object({ kind: z.enum(['inspection', 'replacement']), dueOn: date, status: z.enum(['ok', 'due_soon', 'overdue', 'replace_now']) }).nullable(),
      }),
    ),
    visits: z.array(
      z.object({
        visitedOn: date,
        type: z.enum(E.VISIT_TYPES),
        outcome: z.enum(E.VISIT_OUTCOMES).nullable(),
        outcomeReason: nullableText(),
        findings: text(),
        recommendations: text(),
        checklist: z.array(z.object({ section: text(), label: text(), mark: z.enum(E.CHECK_MARKS).nullable() })),
        readings: z.record(text(), z.unknown()).describe('The readings as taken, in the units their names carry.'),
        results: z.record(text(), z.unknown()).describe('What the readings were computed to mean, with the sources used.'),
        readingsInWords: z.array(reading),
        partSwaps: z.array(z.object({ part: text(), swappedOn: date, reason: nullableText(), newDescription: nullableText() })),
        amendments: z.array(z.object({ reason: text(), changes: z.record(text(), z.unknown()), madeAt: z.iso.datetime({ offset: true }) })),
      }),
    ),
    photos: z.array(z.object({ kind: text(), caption: nullableText(), takenOn: date })),
  })
  .describe('Lifeplate life-record export, version 1: one appliance, its parts, every completed visit and its photos (listed).');

export type LifeRecordExport = z.infer<typeof lifeRecordExportSchema>;

/** The committed JSON Schema document, generated from the zod schema. */
export function lifeRecordJsonSchema() {
  return {
    ...z.toJSONSchema(lifeRecordExportSchema, { target: 'draft-2020-12', io: 'output' }),
    $id: 'https://lifeplate.invalid/schemas/life-record-export.v1.json',
    title: 'Lifeplate life-record export, version 1',
  };
}

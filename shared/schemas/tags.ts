/**
 * QR tags. Routes (under /api):
 *
 *   POST /tag-batches                 TagBatchDto (with codes)   catalog:manage  (count 1–300 new unassigned tags)
 *   GET  /tag-batches                 TagBatchDto[]              catalog:manage
 *   GET  /tag-batches/:id/pdf         application/pdf            catalog:manage  (QR encodes `${BASE_URL}/t/<code>`)
 *   POST /tags/assign                 TagDto                     records:write   (409 if the tag is taken, or the appliance
 *                                                                                 has a tag and replaceDamaged is not set)
 *   GET  /tags/:code/resolve          TagResolutionDto           signed-in       (404 unless the caller may see it)
 *   GET  /public/tags/:code           PublicTagDto               public          (company name and phone only)
 *   POST /visits/arrive-by-tag        VisitDto                   visits:record   (starts a visit on the tagged appliance)
 */
import { z } from 'zod';
import { storableText } from './common';
import { checkTagCode } from '../tags/tag-code';
import { VISIT_TYPES } from './enums';

export const TAG_STATUSES = ['unassigned', 'assigned', 'retired'] as const;
export type TagStatus = (typeof TAG_STATUSES)[number];
export const TAG_FORMAT_IDS = ['sheet_1x2_625', 'single_large'] as const;
export type TagFormatId = (typeof TAG_FORMAT_IDS)[number];
export const MAX_TAGS_PER_BATCH = 300;

/** A tag code as typed or scanned; normalised, and refused with the reason when it does not check out. */
export const tagCode = storableText('Enter the tag code.').transform((input, ctx) => {
  const check = checkTagCode(input);
  if (!check.ok) {
    ctx.addIssue({ code: 'custom', message: check.reason });
    return z.NEVER;
  }
  return check.code;
});
export const tagCodeParam = z.object({ code: tagCode });

export const tagBatchInput = z.object({
  count: z.coerce
    .number('Give how many tags to make.')
    .int('A whole number of tags.')
    .min(1, 'At least 1 tag.')
    .max(MAX_TAGS_PER_BATCH, `At most ${MAX_TAGS_PER_BATCH} tags in one batch.`),
  format: z.enum(TAG_FORMAT_IDS, 'Choose a label format.'),
});
export type TagBatchInput = z.input<typeof tagBatchInput>;

export const tagAssignInput = z.object({
  code: tagCode,
  applianceId: z.uuid('Pick an appliance.'),
  /** The appliance's current tag is damaged or lost: retire it (it keeps opening this record) and attach this one. */
  replaceDamaged: z.boolean().default(false),
});
export type TagAssignInput = z.input<typeof tagAssignInput>;

export const arriveByTagInput = z.object({
  code: tagCode,
  type: z.enum(VISIT_TYPES, 'Choose the visit type.').default('annual_maintenance'),
});
export type ArriveByTagInput = z.input<typeof arriveByTagInput>;

export type TagBatchDto = {
  id: string;
  format: TagFormatId;
  count: number;
  assignedCount: number;
  createdAt: string;
  createdByName: string | null;
  /** Only in the answer to POST. */
  codes?: string[];
};

export type TagDto = {
  id: string;
  code: string;
  status: TagStatus;
  applianceId: string | null;
  assignedAt: string | null;
  retiredAt: string | null;
  retiredNote: string | null;
  replacedByTagId: string | null;
};

export type TagResolutionDto =
  | { status: TagStatus; applianceId?: string; retiredNote?: string | null }
  | { applianceId: string; homeowner: true };

export type PublicTagDto = { known: boolean; companyName: string | null; companyPhone: string | null };

/**
 * Photos of an appliance (nameplate, before/after, findings). Routes (under /api, tenant-filtered):
 *
 *   POST  /photos                 multipart: applianceId, visitId?, componentId?, kind, caption?, homeownerVisible?,
 *                                 files (1–10 images, each ≤ 25 MB)
 *                                 → PhotoUploadDto; 201 if any was new, 200 if every file was already on the record
 *                                                                                        visits:record
 *   GET   /photos?applianceId=    PhotoDto[]                                              records:read
 *   GET   /photos/:id/display     image/jpeg (≤ 1600 px)   members with records:read; homeowners for their own
 *   GET   /photos/:id/thumb       image/jpeg (≤ 320 px)    appliance's homeowner-visible photos
 *   PATCH /photos/:id             PhotoDto                                                records:write
 */
import { z } from 'zod';
import { nonEmptyPatch, optionalText } from './common';

export const PHOTO_KINDS = ['nameplate', 'before', 'after', 'finding', 'other'] as const;
export type PhotoKind = (typeof PHOTO_KINDS)[number];
export const PHOTO_KIND_LABELS: Record<PhotoKind, string> = {
  nameplate: 'Nameplate',
  before: 'Before',
  after: 'After',
  finding: 'Finding',
  other: 'Other',
};
export const MAX_PHOTO_FILES = 10;
export const MAX_PHOTO_BYTES = 25 * 1024 * 1024;

const emptyToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);

/** The text fields of the multipart upload (every value arrives as a string). */
export const photoUploadFields = z.object({
  applianceId: z.uuid('Pick an appliance.'),
  visitId: z.preprocess(emptyToUndefined, z.uuid('Not a valid visit.').optional()),
  componentId: z.preprocess(emptyToUndefined, z.uuid('Not a valid part.').optional()),
  kind: z.enum(PHOTO_KINDS, 'Choose what the photo shows.'),
  caption: optionalText(500),
  homeownerVisible: z.preprocess(emptyToUndefined, z.stringbool('Use true or false.').default(false)),
});
export type PhotoUploadFields = z.output<typeof photoUploadFields>;

export const photoListQuery = z.object({ applianceId: z.uuid('Pick an appliance.') });

export const photoPatch = nonEmptyPatch(z.object({ caption: optionalText(500), homeownerVisible: z.boolean('Use true or false.') }).partial());

export type PhotoDto = {
  id: string;
  applianceId: string;
  visitId: string | null;
  componentId: string | null;
  kind: PhotoKind;
  caption: string | null;
  homeownerVisible: boolean;
  sha256: string;
  width: number;
  height: number;
  bytes: number;
  createdAt: string;
  createdByName: string | null;
  displayUrl: string;
  thumbUrl: string;
};

export type PhotoUploadDto = { photos: (PhotoDto & { duplicate: boolean })[] };

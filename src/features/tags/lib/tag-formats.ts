import type { TagFormatId } from '@shared/schemas/tags';

/** Described by size only (the same words the server prints on the sheet). */
export const TAG_FORMAT_LABELS: Record<TagFormatId, string> = {
  sheet_1x2_625: 'Sheet of 1 × 2⅝ in labels (3 × 10 on US Letter)',
  single_large: 'Single large tag, 4 × 2½ in',
};

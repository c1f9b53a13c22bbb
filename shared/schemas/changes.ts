/**
 * The history of changes: the audit trail of one life record or one visit, in words, for the office.
 *
 *   GET /appliances/:id/changes?limit=&cursor=   ChangesPageDto  records:history (owners and managers; newest first, keyset)
 *   GET /visits/:id/changes?limit=&cursor=       ChangesPageDto  records:history
 */
import { z } from 'zod';
import { storableText } from './common';

export const changesQuery = z.object({
  limit: z.coerce
    .number('The page size must be a number.')
    .int('The page size must be a whole number.')
    .min(1, 'The page size must be at least 1.')
    .max(100, 'The page size must be at most 100.')
    .default(25),
  /** The previous page's nextCursor: the id of its last entry. */
  cursor: storableText()
    .regex(/^[1-9]\d{0,17}$/, 'Not a cursor from the previous page.')
    .optional(),
});
export type ChangesQuery = z.input<typeof changesQuery>;

export type ChangeDto = {
  id: string;
  /** An instant (ISO); the screen renders it with shared/format/dates.ts in the company's time zone. */
  at: string;
  /** The member's name; null when nobody signed in did it (a share-link holder, a scheduled job). */
  who: string | null;
  /** One plain sentence: "Completed the visit", "Amended the visit". */
  what: string;
  /** What changed, one sentence each: "Changed the CO reading from 40 ppm to 120 ppm." */
  details: string[];
  /** The amendment's reason or the entry's note, when it has one. */
  why: string | null;
  /** The visit the change belongs to (a visit's own change, a part swap or a photo taken on it), else null. */
  visit: { id: string; visitedOn: string } | null;
};
export type ChangesPageDto = { items: ChangeDto[]; nextCursor: string | null };

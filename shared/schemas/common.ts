import { z } from 'zod';

/**
 * PostgreSQL's `text` and `jsonb` cannot hold U+0000, and a lone UTF-16 surrogate is not Unicode text at all: jsonb
 * refuses it and a text column would silently store U+FFFD instead. With the `u` flag, \p{Cs} matches only a surrogate
 * that is not part of a pair.
 */
const UNSTORABLE_CHARACTER = /[\0\p{Cs}]/u;
export const UNSTORABLE_TEXT_MESSAGE = 'This text contains a character that cannot be stored.';
export const isStorableText = (value: string) => !UNSTORABLE_CHARACTER.test(value);

/** The one string builder for every schema: any text a request carries must be storable as it is. */
export const storableText = (params?: Parameters<typeof z.string>[0]) => z.string(params).refine(isStorableText, UNSTORABLE_TEXT_MESSAGE);

export const uuidParam = z.object({ id: z.uuid('Not a valid id.') });
export const isoDate = z.iso.date('Use a date like 2024-10-31.');
export const trimmed = (max = 200) => storableText().trim().max(max, `At most ${max} characters.`);
export const requiredText = (label: string, max = 200) =>
  storableText().trim().min(1, `${label} is required.`).max(max, `At most ${max} characters.`);
export const optionalText = (max = 2000) =>
  storableText()
    .trim()
    .max(max, `At most ${max} characters.`)
    .transform((v) => (v === '' ? null : v))
    .nullish();

export const NOTHING_TO_CHANGE_MESSAGE = 'Nothing to change: send at least one field.';
/** A PATCH must name at least one field; an empty patch is a form-level 400 (details key FORM_ERROR_KEY, "_", from ./errors), never a silent write. */
export const nonEmptyPatch = <T extends z.ZodObject>(schema: T) =>
  schema.refine((patch) => Object.values(patch).some((v) => v !== undefined), { message: NOTHING_TO_CHANGE_MESSAGE, path: [] });

export type ApiErrorBody = { error: { code: string; message: string; details?: Record<string, string[]> } };

import { z } from 'zod';

export const uuidParam = z.object({ id: z.uuid('Not a valid id.') });
export const isoDate = z.iso.date('Use a date like 2024-10-31.');
export const trimmed = (max = 200) => z.string().trim().max(max, `At most ${max} characters.`);
export const requiredText = (label: string, max = 200) => z.string().trim().min(1, `${label} is required.`).max(max, `At most ${max} characters.`);
export const optionalText = (max = 2000) =>
  z
    .string()
    .trim()
    .max(max, `At most ${max} characters.`)
    .transform((v) => (v === '' ? null : v))
    .nullish();

export type ApiErrorBody = { error: { code: string; message: string; details?: Record<string, string[]> } };

import type { z } from 'zod';
import { ApiError, type FieldErrors } from '@/lib/api-client';

/** zod issues keyed by dotted path ("items.3.label"), the same shape the server sends in details. */
export function zodFieldErrors(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) (out[issue.path.map(String).join('.') || '_form'] ??= []).push(issue.message);
  return out;
}

export function describeFailure(err: unknown): { fields: FieldErrors; message: string } {
  if (err instanceof ApiError) {
    const fields = err.details ?? {};
    if (err.offline) return { fields, message: 'No connection. Nothing you typed is lost; try again when you have signal.' };
    return { fields, message: Object.keys(fields).length ? 'Some fields need a look. Nothing you typed is lost.' : err.message };
  }
  return { fields: {}, message: err instanceof Error ? err.message : 'Something went wrong. Nothing you typed is lost.' };
}

/** Messages whose keys no visible field shows, so nothing the server said is dropped. */
export const unclaimedErrors = (errors: FieldErrors, claimed: (key: string) => boolean) =>
  Object.entries(errors)
    .filter(([key]) => !claimed(key))
    .flatMap(([key, messages]) => messages.map((m) => (key === '_form' ? m : `${key}: ${m}`)));

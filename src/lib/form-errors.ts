import type { z } from 'zod';
import { ApiError, type FieldErrors } from '@/lib/api-client';
import { FORM_ERROR_KEY } from '@shared/schemas/errors';

/** zod issues keyed by dotted path ("components.2.installedOn"), the same shape the server sends in details. */
export function zodFieldErrors(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.') || FORM_ERROR_KEY;
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

/** What to show after a failed request: the field errors the server named, and one sentence for the rest. */
export function describeFailure(err: unknown): { fields: FieldErrors; message: string } {
  if (err instanceof ApiError) {
    const fields = err.details ?? {};
    const message = err.offline
      ? 'No connection. Nothing you typed is lost; try again when you have signal.'
      : Object.keys(fields).length
        ? 'Some fields need a look. Nothing you typed is lost.'
        : err.message;
    return { fields, message };
  }
  return { fields: {}, message: err instanceof Error ? err.message : 'Something went wrong. Nothing you typed is lost.' };
}

/** The errors under one prefix, with the prefix taken off: errorsUnder(e, 'components.2') gives { installedOn: [...] }. */
export function errorsUnder(errors: FieldErrors, prefix: string): FieldErrors {
  const out: FieldErrors = {};
  for (const [key, messages] of Object.entries(errors)) {
    if (key === prefix) (out._self ??= []).push(...messages);
    else if (key.startsWith(`${prefix}.`)) out[key.slice(prefix.length + 1)] = messages;
  }
  return out;
}

/** Errors whose keys none of the visible fields claims, so no message is ever silently dropped. */
export function unclaimedErrors(errors: FieldErrors, claimed: (key: string) => boolean): string[] {
  return Object.entries(errors)
    .filter(([key]) => !claimed(key))
    .flatMap(([key, messages]) => messages.map((m) => (key === FORM_ERROR_KEY || key === '_self' ? m : `${key}: ${m}`)));
}

/** '' means "not given" for optional numbers; anything else goes to zod as typed, so it can say what is wrong. */
export const blankToNull = (value: string) => (value.trim() === '' ? null : value.trim());

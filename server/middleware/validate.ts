import type { NextFunction, Request, Response } from 'express';
import { z } from 'zod';
import { validationFailed } from '../lib/http-error';
import { unstorableTextPaths } from '../lib/storable-text';
import { UNSTORABLE_TEXT_MESSAGE } from '../../shared/schemas/common';
import { FORM_ERROR_KEY } from '../../shared/schemas/errors';

type Schemas = { body?: z.ZodType; query?: z.ZodType; params?: z.ZodType };
type Out<S, K extends keyof S> = S[K] extends z.ZodType ? z.output<S[K]> : undefined;
export type Valid<S extends Schemas> = { body: Out<S, 'body'>; query: Out<S, 'query'>; params: Out<S, 'params'> };

/** Field-level messages keyed by dotted path, the shape every form in the client reads. */
export function fieldErrors(error: z.ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    // A refused record key is reported at its record, with the reason: the key itself may be the text we refuse.
    const badKey = issue.code === 'invalid_key';
    const key = (badKey ? issue.path.slice(0, -1) : issue.path).join('.') || FORM_ERROR_KEY;
    (out[key] ??= []).push(badKey ? (issue.issues[0]?.message ?? issue.message) : issue.message);
  }
  return out;
}

export function validate<S extends Schemas>(schemas: S) {
  return (req: Request, res: Response, next: NextFunction) => {
    const valid: Record<string, unknown> = {};
    const errors: Record<string, string[]> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? {});
      if (!result.success) {
        Object.assign(errors, fieldErrors(result.error));
        continue;
      }
      valid[part] = result.data;
      for (const key of unstorableTextPaths(result.data)) (errors[key] ??= []).push(UNSTORABLE_TEXT_MESSAGE);
    }
    if (Object.keys(errors).length) return next(validationFailed(errors));
    res.locals.valid = valid;
    next();
  };
}

export function validated<S extends Schemas>(res: Response, _schemas?: S): Valid<S> {
  return res.locals.valid as Valid<S>;
}

import express, { type RequestHandler } from 'express';
import { HttpError } from '../lib/http-error';

export const JSON_BODY = 'application/json';
export const MULTIPART_BODY = 'multipart/form-data';
export const FORM_BODY = 'application/x-www-form-urlencoded';
export type BodyType = typeof JSON_BODY | typeof MULTIPART_BODY | typeof FORM_BODY;

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
const untyped = (req: { headers: Record<string, unknown> }) => req.headers['content-type'] === undefined;
// Node's own HTTP client sends a POST without a body as an empty chunked body: read it to tell empty from not.
const readUntypedBody = express.raw({ type: untyped, limit: '1mb' });

/**
 * A state-changing request with a body of any other type is refused with 415 and never reaches the handler: a body
 * Express does not parse would otherwise look empty, and the route would run on its defaults. A request without a
 * body passes: actions such as revoking a link need none.
 */
export function requireBodyType(accepted: readonly BodyType[]): RequestHandler {
  const refused = (contentType: string) =>
    new HttpError(415, 'unsupported_media_type', `Send the request body as ${accepted.join(' or ')}.`, {
      contentType: [`${contentType} is not accepted here.`],
    });
  return (req, res, next) => {
    if (!STATE_CHANGING.has(req.method)) return next();
    if (untyped(req)) {
      return readUntypedBody(req, res, (err?: unknown) => {
        if (err) return next(err);
        const empty = !Buffer.isBuffer(req.body) || req.body.length === 0;
        req.body = undefined;
        next(empty ? undefined : refused('A body without a content type'));
      });
    }
    // req.is() answers null when there is no body, false when the body's type is not one of these.
    if (req.is([...accepted]) === false) return next(refused(String(req.headers['content-type'])));
    next();
  };
}

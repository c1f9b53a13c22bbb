import type { Request, RequestHandler, Response } from 'express';
import type { Db } from '../../db/client';
import { HttpError, validationFailed } from '../http-error';
import { requestFingerprint, type UploadedFile } from './fingerprint';
import { idempotencyRepository, type KeyScope } from './idempotency.repository';

/** "The Idempotency-Key HTTP Header Field" (IETF httpapi draft). */
export const IDEMPOTENCY_KEY_HEADER = 'Idempotency-Key';
export const IDEMPOTENT_REPLAYED_HEADER = 'Idempotent-Replayed';
export const MAX_IDEMPOTENCY_KEY_LENGTH = 255;
const KEYED_METHODS = new Set(['POST', 'PUT', 'PATCH']);
/** Far longer than any request may run (uploads included); a claim older than this belongs to a process that died. */
export const STALE_CLAIM_MS = 5 * 60_000;

/** What the route does with its claim on a key once the handler has answered. */
export type IdempotencyClaim = { complete: (status: number, body: unknown) => Promise<void>; release: () => Promise<void> };

declare module 'express-serve-static-core' {
  interface Locals {
    idempotencyDb?: Db;
    idempotencyClaim?: IdempotencyClaim;
  }
}

/** Mounted once on the API router, so every route's idempotencyKey() finds the database without being handed it. */
export const provideIdempotencyStore =
  (db: Db): RequestHandler =>
  (_req, res, next) => {
    res.locals.idempotencyDb = db;
    next();
  };

const keyError = (message: string) => validationFailed({ [IDEMPOTENCY_KEY_HEADER]: [message] });

/**
 * The draft sends the key as a Structured Field string ("…", quoted); a bare token is taken too, since our phone
 * sends its UUID either way. Visible ASCII and spaces only (what an sf-string may hold).
 */
export function parseIdempotencyKey(header: string): string {
  const key = header.length >= 2 && header.startsWith('"') && header.endsWith('"') ? header.slice(1, -1) : header;
  if (key.length === 0) throw keyError('The Idempotency-Key must not be empty.');
  if (key.length > MAX_IDEMPOTENCY_KEY_LENGTH) throw keyError(`The Idempotency-Key must be at most ${MAX_IDEMPOTENCY_KEY_LENGTH} characters.`);
  if (!/^[\x20-\x7e]+$/.test(key)) throw keyError('The Idempotency-Key may hold only printable ASCII characters.');
  return key;
}

function replay(res: Response, status: number, body: unknown) {
  res.setHeader(IDEMPOTENT_REPLAYED_HEADER, 'true');
  if (body === null || body === undefined) res.status(status).end();
  else res.status(status).json(body);
}

/**
 * For a signed-in member's POST, PUT or PATCH that carries an Idempotency-Key: the first request claims the key
 * (an in-progress row, inserted ON CONFLICT DO NOTHING, so of two concurrent requests exactly one wins) and runs;
 * a repeat of a finished one gets the stored answer back without running; a second request while the first runs
 * gets 409; the key sent with a different request gets 422. Runs after the guards and validation, so a refused
 * request (401, 403, 400) never touches the store.
 */
export const idempotencyKey: RequestHandler = async (req, res, next) => {
  try {
    const header = req.headers['idempotency-key'];
    const principal = res.locals.principal;
    if (header === undefined || !KEYED_METHODS.has(req.method) || principal?.kind !== 'member') return next();
    const key = parseIdempotencyKey(Array.isArray(header) ? header.join(', ') : header);
    const db = res.locals.idempotencyDb;
    if (!db) throw new Error('idempotencyKey used without provideIdempotencyStore');

    const scope: KeyScope = { companyId: principal.companyId, userId: principal.userId, key };
    const path = req.originalUrl;
    const files = Array.isArray(req.files) ? (req.files as UploadedFile[]) : undefined;
    const fingerprint = requestFingerprint({ method: req.method, path, body: req.body, files });

    // A row deleted between our failed claim and our read (its request failed, or its claim was stale) is claimed again, once.
    for (let attempt = 0; attempt < 2; attempt++) {
      if (await idempotencyRepository.claim(db, scope, { method: req.method, path, fingerprint, now: new Date() })) {
        res.locals.idempotencyClaim = {
          complete: (status, body) => idempotencyRepository.complete(db, scope, { status, body }),
          release: () => idempotencyRepository.release(db, scope),
        };
        return next();
      }
      const existing = await idempotencyRepository.find(db, scope);
      if (!existing) continue;
      if (existing.fingerprint !== fingerprint) {
        throw new HttpError(422, 'idempotency_key_reused', 'This Idempotency-Key was already used for a different request.', {
          [IDEMPOTENCY_KEY_HEADER]: [`Used first for ${existing.method} ${existing.path} with another body; send this request with a new key.`],
        });
      }
      if (existing.status === 'done') return replay(res, existing.responseStatus ?? 200, existing.responseBody);
      if (await idempotencyRepository.releaseStale(db, scope, new Date(Date.now() - STALE_CLAIM_MS))) continue;
      break;
    }
    throw new HttpError(409, 'idempotency_key_in_progress', 'A request with this Idempotency-Key is still being handled; try again shortly.', {
      [IDEMPOTENCY_KEY_HEADER]: ['A request with this key is in progress.'],
    });
  } catch (err) {
    next(err);
  }
};

/** The handler's answer, stored only when it succeeded. */
export async function settleClaim(req: Request, claim: IdempotencyClaim | undefined, status: number, body: unknown) {
  if (!claim) return;
  if (status >= 200 && status < 300) return claim.complete(status, body ?? null);
  return releaseClaim(req, claim);
}

/**
 * A failed request (4xx or 5xx) is not stored: its row is deleted so the client can correct the request and send it
 * again under the same key. The draft allows either choice; storing failures would pin a phone's fixable mistake
 * (or a passing outage) to its key for a day.
 */
export async function releaseClaim(req: Request, claim: IdempotencyClaim | undefined) {
  if (!claim) return;
  try {
    await claim.release();
  } catch (err) {
    // Left in progress, the key answers 409 until the sweep; the original error is the one the client must see.
    req.log?.warn({ err }, 'could not release an idempotency key');
  }
}

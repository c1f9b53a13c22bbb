import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import type { z } from 'zod';
import type { Permission } from '../../shared/policy';
import { requireHomeowner, requirePermission, requireSignedIn } from '../middleware/authenticate';
import { JSON_BODY, requireBodyType, type BodyType } from '../middleware/body-type';
import { validate, type Valid } from '../middleware/validate';
import { idempotencyKey, releaseClaim, settleClaim } from './idempotency/idempotency-middleware';

/**
 * Every API route declares who may call it; there is no way to register one without saying so.
 */
export type Access = { permission: Permission } | 'homeowner' | 'signed-in' | 'public';
type Schemas = { body?: z.ZodType; query?: z.ZodType; params?: z.ZodType };
type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';
export type RouteEntry = { method: Method; path: string; access: Access; schemas: Schemas; bodyTypes: readonly BodyType[] };

/**
 * Every route defined so far (paths relative to /api), so a test can prove that none is open by accident and can
 * send each one what it claims to accept.
 */
export const routeTable = new Map<string, RouteEntry>();

/** A handler's answer with a status of its own (201 for a new record, 200 for one that already was). */
export class Reply {
  constructor(
    readonly status: number,
    readonly body: unknown,
  ) {}
}
export const reply = (status: number, body: unknown) => new Reply(status, body);

export type RouteHandler<S extends Schemas> = (input: Valid<S>, req: Request, res: Response) => Promise<unknown> | unknown;

function guardFor(access: Access): RequestHandler {
  if (access === 'public') return (_req, _res, next) => next();
  if (access === 'signed-in') return requireSignedIn;
  if (access === 'homeowner') return requireHomeowner;
  return requirePermission(access.permission);
}

export function defineRoute<S extends Schemas>(
  router: Router,
  method: Method,
  path: string,
  /** bodyTypes: the media types the route reads its body from; JSON unless said otherwise. */
  options: { access: Access; schemas?: S; status?: number; bodyTypes?: readonly BodyType[] },
  handler: RouteHandler<S>,
) {
  const bodyTypes = options.bodyTypes ?? [JSON_BODY];
  routeTable.set(`${method} ${path}`, { method, path, access: options.access, schemas: options.schemas ?? {}, bodyTypes });
  // idempotencyKey comes after validation: a refused request never claims a key (see lib/idempotency).
  const chain = [requireBodyType(bodyTypes), guardFor(options.access), validate(options.schemas ?? {}), idempotencyKey];
  router[method](path, ...chain, async (req: Request, res: Response, next: NextFunction) => {
    const claim = res.locals.idempotencyClaim;
    try {
      const result = await handler(res.locals.valid as Valid<S>, req, res);
      // A handler that wrote its own response (a file, a stream) is not replayable.
      if (res.headersSent) return void (await releaseClaim(req, claim));
      const { status, body } =
        result instanceof Reply ? result : result === undefined ? { status: 204, body: undefined } : { status: options.status ?? 200, body: result };
      // Stored before it is sent, so a repeat that arrives the moment the answer does is replayed, not refused.
      await settleClaim(req, claim, status, body);
      if (body === undefined) res.status(status).end();
      else res.status(status).json(body);
    } catch (err) {
      await releaseClaim(req, claim);
      next(err);
    }
  });
}

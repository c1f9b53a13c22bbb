import type { Request, RequestHandler, Response, Router } from 'express';
import type { z } from 'zod';
import type { Permission } from '../../shared/policy';
import { requireHomeowner, requirePermission, requireSignedIn } from '../middleware/authenticate';
import { JSON_BODY, requireBodyType, type BodyType } from '../middleware/body-type';
import { validate, type Valid } from '../middleware/validate';

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
  router[method](path, requireBodyType(bodyTypes), guardFor(options.access), validate(options.schemas ?? {}), async (req, res, next) => {
    try {
      const result = await handler(res.locals.valid as Valid<S>, req, res);
      if (res.headersSent) return;
      if (result === undefined) res.status(204).end();
      else res.status(options.status ?? 200).json(result);
    } catch (err) {
      next(err);
    }
  });
}

import type { Request, RequestHandler, Response, Router } from 'express';
import type { z } from 'zod';
import type { Permission } from '../../shared/policy';
import { requireHomeowner, requirePermission, requireSignedIn } from '../middleware/authenticate';
import { validate, type Valid } from '../middleware/validate';

/**
 * Every API route declares who may call it; there is no way to register one without saying so.
 */
export type Access = { permission: Permission } | 'homeowner' | 'signed-in' | 'public';
type Schemas = { body?: z.ZodType; query?: z.ZodType; params?: z.ZodType };
type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** Every route defined so far (paths relative to /api), so a test can prove that none is open by accident. */
export const routeTable = new Map<string, { method: Method; path: string; access: Access }>();

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
  options: { access: Access; schemas?: S; status?: number },
  handler: RouteHandler<S>,
) {
  routeTable.set(`${method} ${path}`, { method, path, access: options.access });
  router[method](path, guardFor(options.access), validate(options.schemas ?? {}), async (req, res, next) => {
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

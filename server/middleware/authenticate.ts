import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { fromNodeHeaders } from 'better-auth/node';
import type { AppContext } from '../context';
import { findPrincipal } from '../auth/principal-repository';
import { forbidden, unauthorized } from '../lib/http-error';
import { can, type Permission } from '../../shared/policy';
import type { Principal } from '../../shared/schemas/roles';

type Member = Extract<Principal, { kind: 'member' }>;
type Homeowner = Extract<Principal, { kind: 'homeowner' }>;

declare module 'express-serve-static-core' {
  interface Locals {
    session?: { userId: string; name: string; email: string };
    principal?: Principal | null;
  }
}

/** Reads the session (if any) and who the user is to Lifeplate. It never rejects: the guards below do. */
export function loadSession(ctx: AppContext): RequestHandler {
  return async (req, res, next) => {
    try {
      const { response: session, headers } = await ctx.auth.api.getSession({ headers: fromNodeHeaders(req.headers), returnHeaders: true });
      // When the session cookie cache is refreshed, the new cookie goes back to the browser.
      for (const cookie of headers.getSetCookie()) res.append('Set-Cookie', cookie);
      if (session) {
        const principal = await findPrincipal(ctx.db, { id: session.session.id, userId: session.user.id });
        if (principal !== 'ended') {
          res.locals.session = { userId: session.user.id, name: session.user.name, email: session.user.email };
          res.locals.principal = principal;
        }
      }
      next();
    } catch (err) {
      next(err);
    }
  };
}

export function currentMember(res: Response): Member {
  const p = res.locals.principal;
  if (!p || p.kind !== 'member') throw new Error('currentMember used on a route without requirePermission');
  return p;
}

export function currentHomeowner(res: Response): Homeowner {
  const p = res.locals.principal;
  if (!p || p.kind !== 'homeowner') throw new Error('currentHomeowner used on a route without requireHomeowner');
  return p;
}

export const requireSignedIn: RequestHandler = (_req, res, next) => next(res.locals.session ? undefined : unauthorized());

export function requirePermission(permission: Permission): RequestHandler {
  return (_req: Request, res: Response, next: NextFunction) => {
    if (!res.locals.session) return next(unauthorized());
    if (!can(res.locals.principal, permission)) return next(forbidden());
    next();
  };
}

export const requireHomeowner: RequestHandler = (_req, res, next) => {
  if (!res.locals.session) return next(unauthorized());
  if (res.locals.principal?.kind !== 'homeowner') return next(forbidden('This is for homeowners.'));
  next();
};

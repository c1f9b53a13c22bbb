import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { describeMe } from './me.service';

export function meRoutes(ctx: AppContext) {
  const router = Router();
  // Public so that a signed-out browser asks without an error: it learns it is signed out from `user: null`.
  defineRoute(router, 'get', '/me', { access: 'public' }, (_i, _req, res) => describeMe(ctx, res));
  return router;
}

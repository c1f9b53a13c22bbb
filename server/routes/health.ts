import cluster from 'node:cluster';
import { Router } from 'express';
import type { AppContext } from '../context';
import { defineRoute } from '../lib/route';
import { RETRY_AFTER_SECONDS } from '../lib/unavailable';

export function healthRoutes(ctx: AppContext) {
  const router = Router();
  defineRoute(router, 'get', '/health', { access: 'public' }, async (_input, _req, res) => {
    try {
      await ctx.pool.query('select 1');
      // Under WEB_CONCURRENCY > 1, which worker answered (scripts/app-process.ts); a single process says nothing more.
      return cluster.isWorker ? { status: 'ok', db: 'ok', worker: { id: cluster.worker!.id, pid: process.pid } } : { status: 'ok', db: 'ok' };
    } catch {
      res.setHeader('Retry-After', String(RETRY_AFTER_SECONDS));
      res.status(503).json({ status: 'degraded', db: 'unreachable' });
    }
  });
  return router;
}

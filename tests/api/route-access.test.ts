import crypto from 'node:crypto';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { routeTable } from '../../server/lib/route';
import { testApp } from '../support/context';

// Routes anyone may call without signing in; every other route must answer 401 to a stranger.
const PUBLIC = new Set([
  'get /health',
  'get /me',
  'get /public/tags/:code',
  'get /share/:token',
  'get /share/:token/photos/:photoId/:variant',
  'post /share/:token/service-requests',
  'get /share/:token/visits/:visitId/report',
  'get /share/:token/life-record.json',
  'get /share/:token/life-record.pdf',
  'get /unsubscribe/:token',
  'post /unsubscribe/:token',
  'get /booking-reply/:token',
  'post /booking-reply/:token',
]);

describe('deny by default', () => {
  const { app, ctx } = testApp();
  afterAll(() => ctx.pool.end());

  it('lists exactly the known public routes as public', () => {
    const open = [...routeTable.values()].filter((r) => r.access === 'public').map((r) => `${r.method} ${r.path}`);
    expect(open.sort()).toEqual([...PUBLIC].sort());
  });

  it('answers 401 on every other route when signed out', async () => {
    const guarded = [...routeTable.values()].filter((r) => r.access !== 'public');
    expect(guarded.length).toBeGreaterThan(3);
    for (const route of guarded) {
      const url = `/api${route.path.replace(/:[a-zA-Z]+/g, () => crypto.randomUUID())}`;
      const res = await request(app)[route.method](url).send({});
      expect({ route: `${route.method} ${route.path}`, status: res.status }).toEqual({ route: `${route.method} ${route.path}`, status: 401 });
    }
  });
});

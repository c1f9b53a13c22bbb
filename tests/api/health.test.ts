import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { testApp } from '../support/context';
import { freePort } from '../support/global-setup';

describe('GET /api/health', () => {
  const { app, ctx } = testApp();
  afterAll(() => ctx.pool.end());

  it('reports ok when the database answers', async () => {
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', db: 'ok' });
  });

  it('answers 503 when the database cannot be reached', async () => {
    // An app pointed at a closed port, so the shared test database is left alone.
    const port = await freePort();
    const down = testApp({ DATABASE_URL: `postgres://lifeplate@127.0.0.1:${port}/nowhere` });
    try {
      const res = await request(down.app).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.body).toEqual({ status: 'degraded', db: 'unreachable' });
    } finally {
      await down.ctx.pool.end();
    }
  });
});

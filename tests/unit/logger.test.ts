import { Writable } from 'node:stream';
import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { createLogger, requestLogger, type LogFormat } from '../../server/logger';

/** An app that answers 200, 401 and a 500 (logged where it is handled, as server/middleware/error-handler.ts does). */
function appLoggingTo(format: LogFormat, level: string) {
  const chunks: string[] = [];
  const sink = new Writable({
    write(chunk, _enc, done) {
      chunks.push(String(chunk));
      done();
    },
  });
  const logger = createLogger(level, format, sink);
  const app = express();
  app.use(requestLogger(logger, format));
  app.get('/api/due', (_req, res) => res.json({ items: [] }));
  app.get('/api/company', (_req, res) => res.status(401).json({ error: { code: 'unauthorized' } }));
  app.get('/api/broken', () => {
    throw new Error('the database went away');
  });
  app.use((err: Error, req: express.Request, res: express.Response, _next: express.NextFunction) => {
    req.log.error({ err }, 'request failed');
    res.status(500).json({ error: { code: 'internal' } });
  });
  /** The lines written so far; the pretty stream hands them on a tick or two after the response. */
  const lines = async (count: number) => {
    for (let tick = 0; tick < 50 && chunks.join('').split('\n').filter(Boolean).length < count; tick++) await new Promise((r) => setImmediate(r));
    return chunks.join('').split('\n').filter(Boolean);
  };
  return { app, lines };
}

describe('pretty logs (npm start, npm run dev)', () => {
  it('keeps request lines out of the terminal at info, and prints a failure as two readable lines with the stack', async () => {
    const { app, lines } = appLoggingTo('pretty', 'info');
    await request(app).get('/api/due').expect(200);
    await request(app).get('/api/company').expect(401);
    await request(app).get('/api/broken').expect(500);
    const out = await lines(3);
    expect(out[0]).toMatch(/^\[\d\d:\d\d:\d\d\] ERROR: request failed ?$/);
    expect(out.join('\n')).toContain('Error: the database went away');
    expect(out.join('\n')).toMatch(/ERROR: GET \/api\/broken 500 \d+ ms$/m);
    expect(out.join('\n')).not.toContain('/api/due');
    expect(out.join('\n')).not.toContain('/api/company');
    expect(out.join('\n')).not.toContain('{"');
  });

  it('shows each request as one short line at debug', async () => {
    const { app, lines } = appLoggingTo('pretty', 'debug');
    await request(app).get('/api/due?limit=5').set('Cookie', 'lifeplate.session_token=secret').expect(200);
    await request(app).get('/api/company').expect(401);
    const out = await lines(2);
    expect(out).toHaveLength(2);
    expect(out[0]).toMatch(/^\[\d\d:\d\d:\d\d\] DEBUG: GET \/api\/due\?limit=5 200 \d+ ms$/);
    expect(out[1]).toMatch(/^\[\d\d:\d\d:\d\d\] DEBUG: GET \/api\/company 401 \d+ ms$/);
  });
});

describe('JSON logs (production)', () => {
  it('writes one JSON object a request, with a failure at error level and the cookie redacted', async () => {
    const { app, lines } = appLoggingTo('json', 'info');
    await request(app).get('/api/due').set('Cookie', 'lifeplate.session_token=secret').expect(200);
    await request(app).get('/api/broken').expect(500);
    const entries = (await lines(3)).map((l) => JSON.parse(l));
    const done = entries.find((e) => e.req?.url === '/api/due');
    // pino's levels: 30 info, 50 error.
    expect(done).toMatchObject({ level: 30, msg: 'request completed', res: { statusCode: 200 } });
    expect(done.req.headers.cookie).toBe('[Redacted]');
    expect(entries.filter((e) => e.req?.url === '/api/broken').map((e) => e.level)).toEqual([50, 50]);
  });
});

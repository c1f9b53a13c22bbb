import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { testContext } from '../support/context';

/** The smallest client build the app serves: every path that is not an asset answers this index.html. */
const clientDir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-robots-'));
fs.writeFileSync(path.join(clientDir, 'index.html'), '<!doctype html><html><head><title>Lifeplate</title></head><body><div id="root"></div></body></html>');

const ctx = testContext();
const app = createApp(ctx, { clientDir });
afterAll(() => ctx.pool.end());

/** The groups of a robots.txt as RFC 9309 reads them: a user-agent line, then its rules. */
function parseRobots(text: string) {
  const lines = text.split('\n').map((l) => l.replace(/#.*$/, '').trim()).filter(Boolean);
  return lines.map((l) => {
    const match = /^([A-Za-z-]+):\s*(.*)$/.exec(l);
    if (!match) throw new Error(`not a robots.txt line: ${l}`);
    return { field: match[1].toLowerCase(), value: match[2] };
  });
}

describe('GET /robots.txt', () => {
  it('answers a plain-text robots file, not the app page, keeping crawlers off private links and the API', async () => {
    const res = await request(app).get('/robots.txt');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/plain; charset=utf-8');
    expect(res.text).not.toContain('<html');
    const rules = parseRobots(res.text);
    expect(rules[0]).toEqual({ field: 'user-agent', value: '*' });
    const disallowed = rules.filter((r) => r.field === 'disallow').map((r) => r.value);
    expect(disallowed).toEqual(expect.arrayContaining(['/s/', '/t/', '/my/', '/unsubscribe/', '/booking-reply/', '/api/']));
    expect(rules.every((r) => ['user-agent', 'disallow'].includes(r.field))).toBe(true);
  });

  it('still serves the app page for the app paths', async () => {
    const res = await request(app).get('/due');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
  });

  it('serves a booking e-mail’s reply page unindexed and unstored, like the share page', async () => {
    const res = await request(app).get(`/booking-reply/${crypto.randomUUID()}.abc`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.headers['x-robots-tag']).toBe('noindex, nofollow');
    expect(res.headers['cache-control']).toBe('private, no-store');
  });
});

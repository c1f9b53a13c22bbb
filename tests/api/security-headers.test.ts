import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { testApp } from '../support/context';

describe('security headers', () => {
  const plain = testApp({ BASE_URL: 'http://192.0.2.10:3000' });
  const secure = testApp({ BASE_URL: 'https://lifeplate.example.test' });
  afterAll(async () => {
    await plain.ctx.pool.end();
    await secure.ctx.pool.end();
  });

  it('allows only our own origin, and sends no HSTS over plain http', async () => {
    const res = await request(plain.app).get('/api/health');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("img-src 'self' data: blob:");
    expect(csp).not.toContain('upgrade-insecure-requests');
    expect(res.headers['strict-transport-security']).toBeUndefined();
    expect(res.headers['referrer-policy']).toBe('no-referrer');
  });

  it('adds HSTS and upgrade-insecure-requests when the base URL is https', async () => {
    const res = await request(secure.app).get('/api/health');
    expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    expect(res.headers['content-security-policy']).toContain('upgrade-insecure-requests');
  });

  it('answers an unknown API route with the JSON error shape', async () => {
    const res = await request(plain.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { code: 'not_found', message: 'No such API route.' } });
  });
});

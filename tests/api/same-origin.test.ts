import { eq } from 'drizzle-orm';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { shareLinks } from '../../server/db/schema/index';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import { testApp, testConfig } from '../support/context';
import { useTenantWithBoiler } from '../support/tenant-fixture';

const { app, ctx } = testApp();
const OWN_ORIGIN = testConfig().BASE_URL;
const f = useTenantWithBoiler(app, ctx);

const linkCount = async () => (await ctx.db.select().from(shareLinks).where(eq(shareLinks.applianceId, f.boilerId))).length;
const makeLink = (headers: Record<string, string>) => {
  let req = f.as.manager.post(`/api/appliances/${f.boilerId}/share-links`);
  for (const [name, value] of Object.entries(headers)) req = req.set(name, value);
  return req.send({ label: 'for the owner' });
};

describe('a state-changing API request', () => {
  it('from the app’s own origin is served', async () => {
    expect(OWN_ORIGIN).toBe('http://127.0.0.1:3999');
    const before = await linkCount();
    expect((await makeLink({ Origin: OWN_ORIGIN })).status).toBe(201);
    expect((await makeLink({ 'Sec-Fetch-Site': 'same-origin' })).status).toBe(201);
    expect((await makeLink({ Origin: OWN_ORIGIN, 'Sec-Fetch-Site': 'same-origin' })).status).toBe(201);
    expect(await linkCount()).toBe(before + 3);
  });

  it('from another origin is refused with 403 foreign_origin and writes nothing, even with a valid session', async () => {
    const before = await linkCount();
    const foreign: Record<string, string>[] = [
      { Origin: 'http://evil.test' },
      // Same host, another port or scheme, is another origin.
      { Origin: 'http://127.0.0.1:4000' },
      { Origin: 'https://127.0.0.1:3999' },
      // Sent by browsers for opaque origins (sandboxed frames, some redirects).
      { Origin: 'null' },
      { 'Sec-Fetch-Site': 'cross-site' },
      { 'Sec-Fetch-Site': 'same-site' },
    ];
    for (const headers of foreign) {
      const res = await makeLink(headers);
      expect({ headers, status: res.status, code: res.body.error?.code }).toEqual({ headers, status: 403, code: 'foreign_origin' });
    }
    const patch = await f.as.manager.patch(`/api/customers/${f.t.customer.id}`).set('Origin', 'http://evil.test').send({ name: 'Taken Over' });
    expect(patch.status).toBe(403);
    expect(await linkCount()).toBe(before);
  });

  it('with neither Origin nor Sec-Fetch-Site did not come from a web page and is served', async () => {
    const before = await linkCount();
    expect((await makeLink({})).status).toBe(201);
    expect(await linkCount()).toBe(before + 1);
  });

  it('is judged by Origin when both are sent', async () => {
    expect((await makeLink({ Origin: 'http://evil.test', 'Sec-Fetch-Site': 'same-origin' })).status).toBe(403);
  });
});

describe('requests the origin check leaves alone', () => {
  it('reads: a GET from another origin is answered as usual', async () => {
    const res = await f.as.manager.get(`/api/appliances/${f.boilerId}/share-links`).set('Origin', 'http://evil.test').set('Sec-Fetch-Site', 'cross-site');
    expect(res.status).toBe(200);
  });

  it('the RFC 8058 one-click unsubscribe, which mail programs post from elsewhere (its token is the only key)', async () => {
    const res = await request(app).post('/api/unsubscribe/not-a-token').set('Origin', 'https://mail.example.test').type('form').send('List-Unsubscribe=One-Click');
    expect(res.status).toBe(404);
  });

  it('better-auth’s own routes, which check their trusted origins themselves', async () => {
    const own = await request(app).post('/api/auth/sign-in/email').set('Origin', OWN_ORIGIN).send({ email: f.t.owner.user.email, password: DEFAULT_TEST_PASSWORD });
    expect(own.status).toBe(200);
  });
});

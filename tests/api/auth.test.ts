import request from 'supertest';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testApp } from '../support/context';
import { createTenant, signIn, type Tenant } from '../support/tenant';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import { sessions } from '../../server/db/schema/index';

const { app, ctx } = testApp();
let t: Tenant;
beforeAll(async () => {
  t = await createTenant(ctx.db);
});
afterAll(() => ctx.pool.end());

describe('sign-in and sign-out', () => {
  it('shows who is signed in, with their role and company', async () => {
    const agent = await signIn(app, t.technician.user.email);
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.principal).toEqual({ kind: 'member', userId: t.technician.user.id, companyId: t.company.id, role: 'technician' });
    expect(me.body.company.id).toBe(t.company.id);
    // Tests run beside the SMTP fake, so members may open the development outbox.
    expect(me.body.devOutbox).toBe(true);
  });

  it('knows a homeowner by their customer records, not as a member', async () => {
    const agent = await signIn(app, t.homeowner.user.email);
    const me = await agent.get('/api/me');
    expect(me.body.principal).toEqual({ kind: 'homeowner', userId: t.homeowner.user.id, companyId: t.company.id, customerIds: [t.customer.id] });
    expect(me.body.devOutbox).toBe(false);
  });

  it('rejects a wrong password and keeps the person signed out', async () => {
    const agent = request.agent(app);
    const res = await agent.post('/api/auth/sign-in/email').send({ email: t.owner.user.email, password: 'not-the-password' });
    expect(res.status).toBe(401);
    expect((await agent.get('/api/me')).body).toEqual({ user: null });
  });

  it('signs out', async () => {
    const agent = await signIn(app, t.owner.user.email);
    expect((await agent.post('/api/auth/sign-out').send({})).status).toBe(200);
    expect((await agent.get('/api/me')).body).toEqual({ user: null });
    expect((await agent.get('/api/company')).status).toBe(401);
  });
});

/** Signs in with a plain request and returns the cookies as a browser would send them, to be copied elsewhere. */
async function signInCookies(email: string) {
  const res = await request(app).post('/api/auth/sign-in/email').send({ email, password: DEFAULT_TEST_PASSWORD });
  expect(res.status).toBe(200);
  const setCookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  return setCookies.map((c) => c.split(';')[0]).join('; ');
}

/** The session token inside better-auth's signed session cookie (`<token>.<signature>`). */
const sessionToken = (cookie: string) => decodeURIComponent(/session_token=([^;]+)/.exec(cookie)![1]).split('.')[0];

describe('a session ended while its cookie still caches it (better-auth keeps it in the cookie for up to 60 s)', () => {
  it('refuses a copied cookie at once after sign-out', async () => {
    const cookie = await signInCookies(t.manager.user.email);
    // The cookie carries the cached session, so these requests do not read it from the session table...
    expect(cookie).toMatch(/session_data=/);
    expect((await request(app).get('/api/company').set('Cookie', cookie)).status).toBe(200);

    expect((await request(app).post('/api/auth/sign-out').set('Cookie', cookie).send({})).status).toBe(200);
    // ...yet the same cookie, replayed after sign-out, is refused at once.
    expect((await request(app).get('/api/company').set('Cookie', cookie)).status).toBe(401);
    expect((await request(app).get('/api/me').set('Cookie', cookie)).body).toEqual({ user: null });
  });

  it('refuses a session deleted elsewhere (signed out on another device) at once, and keeps the others', async () => {
    const phone = await signInCookies(t.technician.user.email);
    const desk = await signInCookies(t.technician.user.email);
    expect((await request(app).get('/api/company').set('Cookie', phone)).status).toBe(200);
    const deleted = await ctx.db.delete(sessions).where(eq(sessions.token, sessionToken(phone))).returning();
    expect(deleted).toHaveLength(1);
    expect((await request(app).get('/api/company').set('Cookie', phone)).status).toBe(401);
    expect((await request(app).get('/api/company').set('Cookie', desk)).status).toBe(200);
  });

  it('refuses an expired session though its cached copy has not expired', async () => {
    const cookie = await signInCookies(t.owner.user.email);
    await ctx.db.update(sessions).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(sessions.userId, t.owner.user.id));
    expect((await request(app).get('/api/company').set('Cookie', cookie)).status).toBe(401);
  });
});

describe('sign-in rate limit', () => {
  it('answers 429 once an address passes the limit, counting in the database', async () => {
    const limited = testApp({ SIGN_IN_RATE_LIMIT: '3', TRUST_PROXY: 'true' });
    try {
      // A client address of its own, so other test files' sign-ins do not count against it.
      const ip = `203.0.113.${Math.floor(Math.random() * 200) + 1}`;
      const statuses: number[] = [];
      for (let i = 0; i < 5; i++) {
        const res = await request(limited.app)
          .post('/api/auth/sign-in/email')
          .set('X-Forwarded-For', ip)
          .send({ email: t.owner.user.email, password: i < 4 ? 'wrong-password' : DEFAULT_TEST_PASSWORD });
        statuses.push(res.status);
      }
      expect(statuses.slice(0, 3)).toEqual([401, 401, 401]);
      expect(statuses.slice(3)).toEqual([429, 429]);
    } finally {
      await limited.ctx.pool.end();
    }
  });
});

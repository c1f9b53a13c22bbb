import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testApp } from '../support/context';
import { uniqueEmail } from '../support/outbox';
import { createTenant, signIn, type Tenant } from '../support/tenant';
import { DEFAULT_TEST_PASSWORD, insertMember } from '../../server/db/factories/users';
import { sessions, signInThrottle, users } from '../../server/db/schema/index';
import { createSignInThrottle } from '../../server/auth/sign-in-throttle';

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
    // Tests run beside the SMTP fake, but only an owner may open the development outbox.
    expect(me.body.devOutbox).toBe(false);
    expect((await (await signIn(app, t.owner.user.email)).get('/api/me')).body.devOutbox).toBe(true);
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
    const limited = testApp({ SIGN_IN_RATE_LIMIT: '3', TRUST_PROXY: 'loopback' });
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

describe('open sign-up', () => {
  it('is off, and answers the same for a known and a new address, creating nobody', async () => {
    const fresh = uniqueEmail();
    const answers = [];
    for (const email of [t.owner.user.email, fresh]) {
      const res = await request(app).post('/api/auth/sign-up/email').send({ email, password: 'brass valve under the stairs', name: 'Someone' });
      answers.push({ status: res.status, body: res.body });
    }
    expect(answers[0]).toEqual(answers[1]);
    expect(answers[0].status).toBe(400);
    expect(answers[0].body.code).toBe('EMAIL_PASSWORD_SIGN_UP_DISABLED');
    expect(await ctx.db.select().from(users).where(eq(users.email, fresh))).toHaveLength(0);
  });
});

describe('per-address sign-in limit', () => {
  // Forged X-Forwarded-For addresses, believed here (TRUST_PROXY=loopback), so the per-client limit never bites.
  const proxied = testApp({ TRUST_PROXY: 'loopback' });
  afterAll(() => proxied.ctx.pool.end());
  const forged = (i: number) => `198.51.100.${i + 1}`;

  async function thirtyWrongThenRight(email: string, password: string) {
    const statuses: number[] = [];
    for (let i = 0; i < 30; i++) {
      const res = await request(proxied.app).post('/api/auth/sign-in/email').set('X-Forwarded-For', forged(i)).send({ email, password: `wrong-password-${i}` });
      statuses.push(res.status);
    }
    const right = await request(proxied.app).post('/api/auth/sign-in/email').set('X-Forwarded-For', forged(30)).send({ email, password });
    return { statuses, right };
  }

  it('refuses the right password after 30 wrong ones from 30 addresses, and says when to try again', async () => {
    const { user } = await insertMember(ctx.db, { companyId: t.company.id, role: 'technician' });
    const { statuses, right } = await thirtyWrongThenRight(user.email, DEFAULT_TEST_PASSWORD);
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(new Set(statuses.slice(5))).toEqual(new Set([429]));
    expect(right.status).toBe(429);
    expect(right.body).toMatchObject({ code: 'too_many_attempts', message: expect.stringMatching(/Try again in a minute, or e-mail yourself a sign-in link/) });
    expect(Number(right.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(right.headers['retry-after'])).toBeLessThanOrEqual(60);
    expect(right.headers['set-cookie']).toBeUndefined();
  });

  it('answers an address nobody has exactly as a real one', async () => {
    const { statuses, right } = await thirtyWrongThenRight(uniqueEmail(), DEFAULT_TEST_PASSWORD);
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(new Set(statuses.slice(5))).toEqual(new Set([429]));
    expect(right.status).toBe(429);
  });

  it('lets the right password in once the lock is over, and a sign-in clears the count', async () => {
    const { user } = await insertMember(ctx.db, { companyId: t.company.id, role: 'technician' });
    await thirtyWrongThenRight(user.email, DEFAULT_TEST_PASSWORD);
    const key = createSignInThrottle(ctx.db, ctx.config.BETTER_AUTH_SECRET).keyOf(user.email);
    // The lock's minute has passed.
    await ctx.db.update(signInThrottle).set({ lockedUntil: new Date(Date.now() - 1000) }).where(eq(signInThrottle.key, key));
    const res = await request(proxied.app).post('/api/auth/sign-in/email').send({ email: user.email.toUpperCase(), password: DEFAULT_TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(await ctx.db.select().from(signInThrottle).where(eq(signInThrottle.key, key))).toHaveLength(0);
  });
});

describe('an attempt that never judged the password', () => {
  it('is given back, and a lock it set goes with it', async () => {
    const throttle = createSignInThrottle(ctx.db, ctx.config.BETTER_AUTH_SECRET);
    const email = uniqueEmail();
    const now = new Date('2026-12-02T12:00:00Z');
    for (let i = 0; i < 5; i++) expect((await throttle.attempt(email, now)).allowed).toBe(true);
    const stored = async () => (await ctx.db.select().from(signInThrottle).where(eq(signInThrottle.key, throttle.keyOf(email))))[0];
    expect((await stored()).lockedUntil).not.toBeNull();
    await throttle.refund(email);
    expect(await stored()).toMatchObject({ attempts: 4, lockedUntil: null });
  });
});

describe('forwarded client addresses', () => {
  it('are not believed unless TRUST_PROXY names a proxy', async () => {
    const { user } = await insertMember(ctx.db, { companyId: t.company.id, role: 'technician' });
    await request(app).post('/api/auth/sign-in/email').set('X-Forwarded-For', '203.0.113.77').send({ email: user.email, password: DEFAULT_TEST_PASSWORD }).expect(200);
    const proxied = testApp({ TRUST_PROXY: 'loopback' });
    try {
      await request(proxied.app).post('/api/auth/sign-in/email').set('X-Forwarded-For', '203.0.113.78').send({ email: user.email, password: DEFAULT_TEST_PASSWORD }).expect(200);
    } finally {
      await proxied.ctx.pool.end();
    }
    const seen = (await ctx.db.select({ ip: sessions.ipAddress }).from(sessions).where(eq(sessions.userId, user.id))).map((s) => s.ip);
    expect(seen).toHaveLength(2);
    expect(seen).toContain('203.0.113.78');
    expect(seen).not.toContain('203.0.113.77');
  });
});

describe('new passwords', () => {
  it('refuses a short or common one with a field error, and takes a long uncommon one', async () => {
    const { user } = await insertMember(ctx.db, { companyId: t.company.id, role: 'technician' });
    const agent = await signIn(app, user.email);
    for (const [newPassword, why] of [
      ['1234567890', /at least 12 characters/],
      ['password1234', /most common passwords/],
    ] as const) {
      const res = await agent.post('/api/auth/change-password').send({ currentPassword: DEFAULT_TEST_PASSWORD, newPassword });
      expect(res.status).toBe(400);
      expect(res.body.details.newPassword[0]).toMatch(why);
    }
    // Still the old password.
    await signIn(app, user.email);
    const ok = await agent.post('/api/auth/change-password').send({ currentPassword: DEFAULT_TEST_PASSWORD, newPassword: 'brass valve under the stairs' });
    expect(ok.status).toBe(200);
    await signIn(app, user.email, 'brass valve under the stairs');
  });
});


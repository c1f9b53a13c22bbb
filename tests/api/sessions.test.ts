import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { sessions } from '../../server/db/schema/index';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import { testApp } from '../support/context';
import { createTenant, signIn, type Agent, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
const NEW_PASSWORD = 'a-new-password-for-the-test';
// better-auth's session cookie cache (server/auth/auth.ts): a session's signed cookie is trusted this long.
const COOKIE_CACHE_SECONDS = 60;

let t: Tenant;
let laptop: Agent;
let phone: Agent;
let phoneCookie: string;

const sessionRows = () => ctx.db.select().from(sessions).where(eq(sessions.userId, t.technician.user.id));
/** The cookies a device holds, sent as they are, whatever a cookie jar would do with them. */
async function cookiesOf(email: string): Promise<string> {
  const res = await request(app).post('/api/auth/sign-in/email').send({ email, password: DEFAULT_TEST_PASSWORD });
  expect(res.status).toBe(200);
  return (res.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
}

beforeEach(async () => {
  t = await createTenant(ctx.db);
  laptop = await signIn(app, t.technician.user.email);
  phone = await signIn(app, t.technician.user.email);
  phoneCookie = await cookiesOf(t.technician.user.email);
  // Each device has read something, so each holds a cached session cookie.
  for (const device of [laptop, phone]) expect((await device.get('/api/company')).status).toBe(200);
  expect((await request(app).get('/api/company').set('Cookie', phoneCookie)).status).toBe(200);
});
afterEach(() => {
  vi.useRealTimers();
});
afterAll(() => ctx.pool.end());

describe('changing the password', () => {
  it('ends every other session of the user, even when the client does not ask for it', async () => {
    expect(await sessionRows()).toHaveLength(3);
    const res = await laptop.post('/api/auth/change-password').send({ currentPassword: DEFAULT_TEST_PASSWORD, newPassword: NEW_PASSWORD });
    expect(res.status).toBe(200);

    // One session is left: the one the laptop was just given.
    const left = await sessionRows();
    expect(left).toHaveLength(1);
    expect(left[0].token).toBe(res.body.token);
    expect((await laptop.get('/api/company')).status).toBe(200);

    // The other devices are refused once their cached cookie lapses, even if they keep sending it.
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(Date.now() + (COOKIE_CACHE_SECONDS + 1) * 1000);
    expect((await request(app).get('/api/company').set('Cookie', phoneCookie)).status).toBe(401);
    expect((await phone.get('/api/company')).status).toBe(401);
    expect((await phone.get('/api/me')).body).toEqual({ user: null });
    expect((await laptop.get('/api/company')).status).toBe(200);
  });

  it('lets the new password sign in and no longer the old one', async () => {
    await laptop.post('/api/auth/change-password').send({ currentPassword: DEFAULT_TEST_PASSWORD, newPassword: NEW_PASSWORD }).expect(200);
    const old = await request(app).post('/api/auth/sign-in/email').send({ email: t.technician.user.email, password: DEFAULT_TEST_PASSWORD });
    expect(old.status).toBe(401);
    await signIn(app, t.technician.user.email, NEW_PASSWORD);
  });

  it('with a wrong current password changes nothing and ends no session', async () => {
    const res = await laptop.post('/api/auth/change-password').send({ currentPassword: 'not-the-password', newPassword: NEW_PASSWORD });
    expect(res.status).toBe(400);
    expect(await sessionRows()).toHaveLength(3);
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(Date.now() + (COOKIE_CACHE_SECONDS + 1) * 1000);
    expect((await request(app).get('/api/company').set('Cookie', phoneCookie)).status).toBe(200);
    await signIn(app, t.technician.user.email);
  });

  it('is refused without a session', async () => {
    const res = await request(app).post('/api/auth/change-password').send({ currentPassword: DEFAULT_TEST_PASSWORD, newPassword: NEW_PASSWORD });
    expect(res.status).toBe(401);
    await signIn(app, t.technician.user.email);
  });
});

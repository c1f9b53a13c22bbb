import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { closeContext } from '../../server/build-context';
import { photos } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import { testApp, testContext } from '../support/context';
import { freePort } from '../support/global-setup';
import { createTenant, signIn, type Agent, type Tenant } from '../support/tenant';

// The shared test database and S3 fake stay up; apps pointed at a closed port stand for the outage.
const { app, ctx } = testApp();
let t: Tenant;
let closedPort: number;

const expectUnavailable = (res: request.Response) => {
  expect(res.status).toBe(503);
  expect(res.headers['retry-after']).toBe('5');
  expect(res.body).toEqual({ error: { code: 'unavailable', message: expect.stringContaining('Try again') } });
};

beforeAll(async () => {
  t = await createTenant(ctx.db);
  closedPort = await freePort();
});
afterAll(() => closeContext(ctx));

describe('while the database cannot be reached', () => {
  const down = () => testContext({ DATABASE_URL: `postgres://lifeplate@127.0.0.1:${closedPort}/nowhere` });

  it('an API request answers 503 with Retry-After, not 500', async () => {
    // Signed in while the database was up: the session cookie is good, the membership read behind it fails.
    const signedIn = await request(app).post('/api/auth/sign-in/email').send({ email: t.manager.user.email, password: DEFAULT_TEST_PASSWORD });
    const cookies = (signedIn.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]);
    const dctx = down();
    try {
      const res = await request(createApp(dctx)).post('/api/customers').set('Cookie', cookies.join('; ')).send({ name: 'Ada Quill', kind: 'homeowner' });
      expectUnavailable(res);
    } finally {
      await closeContext(dctx);
    }
  });

  it('a session that must be looked up in the database answers 503, not 401 (the phone stays signed in)', async () => {
    const signedIn = await request(app).post('/api/auth/sign-in/email').send({ email: t.manager.user.email, password: DEFAULT_TEST_PASSWORD });
    // Only the session token, without better-auth's signed cache cookie, so the session is read from the database.
    const token = (signedIn.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).filter((c) => c.includes('session_token'));
    expect(token).toHaveLength(1);
    const dctx = down();
    try {
      expectUnavailable(await request(createApp(dctx)).get('/api/me').set('Cookie', token.join('; ')));
    } finally {
      await closeContext(dctx);
    }
  });

  it('signing in answers 503 with Retry-After (better-auth passes the outage on)', async () => {
    const dctx = down();
    try {
      const res = await request(createApp(dctx)).post('/api/auth/sign-in/email').send({ email: t.manager.user.email, password: DEFAULT_TEST_PASSWORD });
      expectUnavailable(res);
    } finally {
      await closeContext(dctx);
    }
  });

  it('the health check says degraded and when to look again', async () => {
    const dctx = down();
    try {
      const res = await request(createApp(dctx)).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.headers['retry-after']).toBe('5');
      expect(res.body).toEqual({ status: 'degraded', db: 'unreachable' });
    } finally {
      await closeContext(dctx);
    }
  });
});

describe('while object storage cannot be reached', () => {
  let s3down: ReturnType<typeof testApp>;
  let technician: Agent;
  let applianceId: string;

  beforeAll(async () => {
    s3down = testApp({ S3_ENDPOINT: `http://127.0.0.1:${closedPort}` });
    technician = await signIn(s3down.app, t.technician.user.email);
    const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
    applianceId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id })).id;
  });
  afterAll(() => closeContext(s3down.ctx));

  it('a photo upload answers 503 with Retry-After and stores no row', async () => {
    const jpeg = await sharp({ create: { width: 40, height: 30, channels: 3, background: { r: 90, g: 90, b: 90 } } }).jpeg().toBuffer();
    const res = await technician.post('/api/photos').field('applianceId', applianceId).field('kind', 'finding').attach('files', jpeg, { filename: 'a.jpg', contentType: 'image/jpeg' });
    expectUnavailable(res);
    expect(await ctx.db.select().from(photos).where(eq(photos.applianceId, applianceId))).toEqual([]);
  });
});

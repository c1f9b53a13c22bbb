import crypto from 'node:crypto';
import sharp from 'sharp';
import type { Response } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { shareLinks } from '../../server/db/schema/index';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { hashShareToken } from '../../server/modules/share-links/resolve-share-token';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Agent, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherAs: Awaited<ReturnType<typeof agentsFor>>;
let boilerId: string;
let heaterId: string;
let neighbourBoilerId: string;
let visible: string;
let hidden: string;
let heaterPhoto: string;
let otherTenantPhoto: string;
let token: string;
let linkId: string;

const binary = (res: Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};
const jpeg = (r: number) => sharp({ create: { width: 400, height: 300, channels: 3, background: { r, g: 80, b: 40 } } }).jpeg().toBuffer();

async function upload(agent: Agent, applianceId: string, homeownerVisible: boolean, shade: number) {
  const res = await agent
    .post('/api/photos')
    .field('applianceId', applianceId)
    .field('kind', 'after')
    .field('homeownerVisible', String(homeownerVisible))
    .attach('files', await jpeg(shade), { filename: 'after.jpg', contentType: 'image/jpeg' });
  expect(res.status).toBe(201);
  return res.body.photos[0].id as string;
}

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  [as, otherAs] = await Promise.all([agentsFor(app, t), agentsFor(app, other)]);
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
  boilerId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id })).id;
  heaterId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'water_heater' })).id;
  const neighbour = await insertCustomer(ctx.db, { companyId: t.company.id });
  neighbourBoilerId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: (await insertSite(ctx.db, { companyId: t.company.id, customerId: neighbour.id })).id })).id;
  const otherSite = await insertSite(ctx.db, { companyId: other.company.id, customerId: other.customer.id });
  const otherBoilerId = (await insertAppliance(ctx.db, { companyId: other.company.id, siteId: otherSite.id })).id;
  visible = await upload(as.technician, boilerId, true, 200);
  hidden = await upload(as.technician, boilerId, false, 30);
  heaterPhoto = await upload(as.technician, heaterId, true, 120);
  otherTenantPhoto = await upload(otherAs.technician, otherBoilerId, true, 90);
  const made = await as.manager.post(`/api/appliances/${boilerId}/share-links`).send({});
  token = made.body.url.split('/s/')[1];
  linkId = made.body.id;
});
afterAll(() => ctx.pool.end());

describe('photos on the share page', () => {
  it('lists only the visible photo in the view and serves its thumbnail and display size as JPEG bytes', async () => {
    const view = await as.anonymous.get(`/api/share/${token}`);
    expect(view.body.photos.map((p: { id: string }) => p.id)).toEqual([visible]);
    for (const variant of ['thumb', 'display'] as const) {
      const res = await as.anonymous.get(`/api/share/${token}/photos/${visible}/${variant}`).buffer(true).parse(binary);
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toBe('image/jpeg');
      expect(res.headers['cache-control']).toMatch(/^private/);
      expect(res.headers['referrer-policy']).toBe('no-referrer');
      const meta = await sharp(res.body as Buffer).metadata();
      expect(meta.format).toBe('jpeg');
      expect(meta.width).toBeGreaterThan(0);
    }
    const etag = (await as.anonymous.get(`/api/share/${token}/photos/${visible}/thumb`)).headers.etag;
    expect((await as.anonymous.get(`/api/share/${token}/photos/${visible}/thumb`).set('If-None-Match', etag)).status).toBe(304);
  });

  it('answers 404 for a hidden photo, another appliance’s, another company’s, or an unknown size', async () => {
    for (const [photoId, variant] of [
      [hidden, 'thumb'],
      [heaterPhoto, 'thumb'],
      [otherTenantPhoto, 'display'],
      [crypto.randomUUID(), 'thumb'],
      [visible, 'original'],
    ]) {
      const res = await as.anonymous.get(`/api/share/${token}/photos/${photoId}/${variant}`);
      expect({ photoId, variant, status: res.status }).toEqual({ photoId, variant, status: 404 });
      expect(res.headers['content-type']).toMatch(/json/);
    }
  });

  it('answers 404 for a token never issued and 410 once revoked or expired', async () => {
    expect((await as.anonymous.get(`/api/share/${crypto.randomBytes(32).toString('base64url')}/photos/${visible}/thumb`)).status).toBe(404);
    const expiredToken = crypto.randomBytes(32).toString('base64url');
    await ctx.db
      .insert(shareLinks)
      .values({ companyId: t.company.id, applianceId: boilerId, tokenHash: hashShareToken(expiredToken), expiresAt: new Date(Date.now() - 1000), createdBy: t.manager.user.id });
    expect((await as.anonymous.get(`/api/share/${expiredToken}/photos/${visible}/thumb`)).status).toBe(410);
    expect((await as.manager.post(`/api/share-links/${linkId}/revoke`)).status).toBe(200);
    const revoked = await as.anonymous.get(`/api/share/${token}/photos/${visible}/thumb`);
    expect(revoked.status).toBe(410);
    expect(revoked.headers['content-type']).toMatch(/json/);
  });
});

describe('photos for the signed-in homeowner', () => {
  it('serves their own appliance’s visible photos and nothing else', async () => {
    const ok = await as.homeowner.get(`/api/homeowner/appliances/${boilerId}/photos/${visible}/display`).buffer(true).parse(binary);
    expect(ok.status).toBe(200);
    expect(ok.headers['content-type']).toBe('image/jpeg');
    expect((await sharp(ok.body as Buffer).metadata()).format).toBe('jpeg');
    expect((await as.homeowner.get(`/api/homeowner/appliances/${boilerId}/photos/${hidden}/thumb`)).status).toBe(404);
    // A photo of their other appliance, asked for under this one, is not this appliance's.
    expect((await as.homeowner.get(`/api/homeowner/appliances/${boilerId}/photos/${heaterPhoto}/thumb`)).status).toBe(404);
    expect((await as.homeowner.get(`/api/homeowner/appliances/${heaterId}/photos/${heaterPhoto}/thumb`)).status).toBe(200);
    expect((await as.homeowner.get(`/api/homeowner/appliances/${neighbourBoilerId}/photos/${visible}/thumb`)).status).toBe(404);
    expect((await as.manager.get(`/api/homeowner/appliances/${boilerId}/photos/${visible}/thumb`)).status).toBe(403);
    expect((await as.anonymous.get(`/api/homeowner/appliances/${boilerId}/photos/${visible}/thumb`)).status).toBe(401);
  });
});

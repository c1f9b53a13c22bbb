import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { customers, photos, shareLinks } from '../../server/db/schema/index';
import { testApp } from '../support/context';
import { useTenantWithBoiler } from '../support/tenant-fixture';

const { app, ctx } = testApp();
const f = useTenantWithBoiler(app, ctx);

const linksOf = () => ctx.db.select().from(shareLinks).where(eq(shareLinks.applianceId, f.boilerId));
const customersOf = () => ctx.db.select().from(customers).where(eq(customers.companyId, f.t.company.id));

describe('a state-changing request whose body is not JSON', () => {
  it('is refused with 415 when JSON text comes as text/plain, and no link is made with the defaults', async () => {
    const res = await f.as.manager
      .post(`/api/appliances/${f.boilerId}/share-links`)
      .set('Content-Type', 'text/plain')
      .send(JSON.stringify({ expiresInDays: 7, label: 'for the tenant' }));
    expect(res.status).toBe(415);
    expect(res.body.error).toMatchObject({ code: 'unsupported_media_type', message: 'Send the request body as application/json.' });
    expect(res.body.error.details.contentType).toEqual(['text/plain is not accepted here.']);
    expect(await linksOf()).toEqual([]);
  });

  it('is refused with 415 as a multipart form or a urlencoded form on a JSON route', async () => {
    const before = (await customersOf()).length;
    const multipart = await f.as.manager.post('/api/customers').field('name', 'Ivy Marsh');
    expect(multipart.status).toBe(415);
    const form = await f.as.manager.post('/api/customers').type('form').send('name=Ivy+Marsh');
    expect(form.status).toBe(415);
    const patch = await f.as.manager.patch(`/api/customers/${f.t.customer.id}`).type('form').send('name=Ivy+Marsh');
    expect(patch.status).toBe(415);
    expect(await customersOf()).toHaveLength(before);
  });

  it('is refused with 415 when a body comes with no content type at all', async () => {
    const res = await f.as.manager.post('/api/customers').set('Content-Length', '18').send(Buffer.from('{"name":"Ivy Mar"}'));
    expect(res.status).toBe(415);
    expect(res.body.error.details.contentType).toEqual(['A body without a content type is not accepted here.']);
  });

  it('passes JSON with a charset, and an action with no body at all', async () => {
    const made = await f.as.manager
      .post(`/api/appliances/${f.boilerId}/share-links`)
      .set('Content-Type', 'application/json; charset=utf-8')
      .send(JSON.stringify({ expiresInDays: 7 }));
    expect(made.status).toBe(201);
    // supertest sends a body-less POST as an empty chunked body, as Node's HTTP client does.
    const revoked = await f.as.manager.post(`/api/share-links/${made.body.id}/revoke`);
    expect(revoked.status).toBe(200);
    expect(revoked.body.status).toBe('revoked');
  });

  it('is JSON on the photo upload route, which takes multipart only: 415, nothing stored', async () => {
    const res = await f.as.technician.post('/api/photos').send({ applianceId: f.boilerId, kind: 'nameplate' });
    expect(res.status).toBe(415);
    expect(res.body.error.message).toBe('Send the request body as multipart/form-data.');
    expect(await ctx.db.select().from(photos).where(eq(photos.applianceId, f.boilerId))).toEqual([]);
  });

  it('answers a multipart form its parser cannot read with 400, not 500', async () => {
    // A NUL in a part's name makes the part header malformed.
    const res = await f.as.technician.post('/api/photos').field('applianceId', f.boilerId).field('kind\u0000', 'nameplate');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('upload_rejected');
  });

  it('does not stop the photo upload itself', async () => {
    const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 90, g: 90, b: 90 } } }).jpeg().toBuffer();
    const res = await f.as.technician
      .post('/api/photos')
      .field('applianceId', f.boilerId)
      .field('kind', 'nameplate')
      .attach('files', jpeg, { filename: 'plate.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(201);
  });
});

import crypto from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import type { Response } from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { auditLog, photos, timelineEvents } from '../../server/db/schema/index';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { photosRepository } from '../../server/modules/photos/photos.repository';
import { sweepOrphanObjects } from '../../server/modules/photos/sweep-orphan-objects';
import { testApp } from '../support/context';
import { exifHasGpsPointer, phoneJpegWithGps, pixelFloodPng } from '../support/images';
import { agentsFor, createTenant, type Agent, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherAs: Awaited<ReturnType<typeof agentsFor>>;
let boiler: Awaited<ReturnType<typeof insertAppliance>>;
let heaterId: string;
let neighbourBoilerId: string;
let otherBoilerId: string;
let boilerVisitId: string;
let heaterVisitId: string;
let otherVisitId: string;
let gpsJpeg: Buffer;

const binary = (res: Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};
const solidJpeg = (r: number, g: number, b: number) => sharp({ create: { width: 300, height: 200, channels: 3, background: { r, g, b } } }).jpeg().toBuffer();
const prefixOf = (applianceId: string, companyId = t.company.id) => `${companyId}/${applianceId}/`;
const rowsFor = (applianceId: string) => ctx.db.select().from(photos).where(eq(photos.applianceId, applianceId));

function send(agent: Agent, fields: Record<string, string>, files: { body: Buffer; name: string; type?: string }[]) {
  let req = agent.post('/api/photos');
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  for (const f of files) req = req.attach('files', f.body, { filename: f.name, contentType: f.type ?? 'image/jpeg' });
  return req;
}

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  [as, otherAs] = await Promise.all([agentsFor(app, t), agentsFor(app, other)]);
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
  boiler = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 } }] });
  heaterId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'water_heater' })).id;
  const neighbour = await insertCustomer(ctx.db, { companyId: t.company.id });
  const neighbourSite = await insertSite(ctx.db, { companyId: t.company.id, customerId: neighbour.id });
  neighbourBoilerId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: neighbourSite.id })).id;
  const otherSite = await insertSite(ctx.db, { companyId: other.company.id, customerId: other.customer.id });
  otherBoilerId = (await insertAppliance(ctx.db, { companyId: other.company.id, siteId: otherSite.id })).id;
  boilerVisitId = (await as.technician.post('/api/visits').send({ applianceId: boiler.id, type: 'repair' })).body.id;
  heaterVisitId = (await as.manager.post('/api/visits').send({ applianceId: heaterId, type: 'repair' })).body.id;
  otherVisitId = (await otherAs.technician.post('/api/visits').send({ applianceId: otherBoilerId, type: 'repair' })).body.id;
  gpsJpeg = await phoneJpegWithGps(640, 480);
});
afterEach(() => {
  vi.restoreAllMocks();
});
afterAll(async () => {
  ctx.storage.destroy();
  await ctx.pool.end();
});

describe('uploading photos', () => {
  let photoId: string;

  it('stores a phone photo upright, without its metadata, under keys the server made', async () => {
    const res = await send(as.technician, { applianceId: boiler.id, kind: 'nameplate', caption: 'Rating plate, left side', homeownerVisible: 'true' }, [
      { body: gpsJpeg, name: '../../evil name.jpg' },
    ]);
    expect(res.status).toBe(201);
    expect(res.body.photos).toHaveLength(1);
    const dto = res.body.photos[0];
    expect(dto).toMatchObject({ applianceId: boiler.id, kind: 'nameplate', caption: 'Rating plate, left side', homeownerVisible: true, width: 480, height: 640, duplicate: false });
    expect(dto.sha256).toBe(crypto.createHash('sha256').update(gpsJpeg).digest('hex'));
    photoId = dto.id;

    const [row] = await rowsFor(boiler.id);
    expect(row).toMatchObject({ id: photoId, companyId: t.company.id, createdBy: t.technician.user.id, bytes: gpsJpeg.length, visitId: null, componentId: null });
    const keyShape = new RegExp(`^${t.company.id}/${boiler.id}/[0-9a-f-]{36}-(display|thumb)\\.jpg$`);
    expect(row.displayKey).toMatch(keyShape);
    expect(row.thumbKey).toMatch(keyShape);
    expect((await ctx.storage.list(prefixOf(boiler.id))).map((o) => o.key).sort()).toEqual([row.displayKey, row.thumbKey].sort());

    const events = await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.applianceId, boiler.id), eq(timelineEvents.kind, 'photo')));
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ refId: photoId, summary: 'Nameplate photo added: Rating plate, left side', homeownerVisible: true });
    expect(await ctx.db.select().from(auditLog).where(and(eq(auditLog.entity, 'photo'), eq(auditLog.entityId, photoId)))).toHaveLength(1);
  });

  it('gives the stored image back byte for byte, with no GPS and a private cache', async () => {
    const [row] = await rowsFor(boiler.id);
    for (const variant of ['display', 'thumb'] as const) {
      const res = await as.manager.get(`/api/photos/${photoId}/${variant}`).buffer(true).parse(binary);
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toBe('image/jpeg');
      expect(res.headers['cache-control']).toBe('private, max-age=86400');
      expect(res.headers.etag).toBe(`"${row.sha256}-${variant}"`);
      const stored = await ctx.storage.get(variant === 'display' ? row.displayKey : row.thumbKey);
      expect((res.body as Buffer).equals(stored.body)).toBe(true);
      const meta = await sharp(res.body as Buffer).metadata();
      expect(meta.exif).toBeUndefined();
      expect(exifHasGpsPointer(res.body as Buffer)).toBe(false);
      expect(meta.height).toBeGreaterThan(meta.width!);
    }
    const again = await as.manager.get(`/api/photos/${photoId}/display`).set('If-None-Match', `"${row.sha256}-display"`);
    expect(again.status).toBe(304);
  });

  it('stores the same file sent twice to the same record once', async () => {
    const res = await send(as.technician, { applianceId: boiler.id, kind: 'nameplate' }, [{ body: gpsJpeg, name: 'again.jpg' }]);
    expect(res.status).toBe(200);
    expect(res.body.photos[0]).toMatchObject({ id: photoId, duplicate: true });
    expect(await rowsFor(boiler.id)).toHaveLength(1);
    expect(await ctx.storage.list(prefixOf(boiler.id))).toHaveLength(2);
  });

  it('files the same picture separately against a visit and a part of that appliance', async () => {
    const part = boiler.components[0];
    const res = await send(as.technician, { applianceId: boiler.id, visitId: boilerVisitId, componentId: part.id, kind: 'before' }, [
      { body: gpsJpeg, name: 'a.jpg' },
      { body: await solidJpeg(10, 200, 30), name: 'b.jpg' },
    ]);
    expect(res.status).toBe(201);
    expect(res.body.photos.map((p: { duplicate: boolean }) => p.duplicate)).toEqual([false, false]);
    const rows = await rowsFor(boiler.id);
    expect(rows).toHaveLength(3);
    expect(rows.filter((r) => r.visitId === boilerVisitId && r.componentId === part.id)).toHaveLength(2);
  });

  it('lists the appliance’s photos for the team', async () => {
    const res = await as.technician.get('/api/photos').query({ applianceId: boiler.id });
    expect(res.status).toBe(200);
    expect(res.body).toHaveLength(3);
    expect(res.body.find((p: { id: string }) => p.id === photoId)).toMatchObject({ displayUrl: `/api/photos/${photoId}/display`, createdByName: t.technician.user.name });
    expect((await as.technician.get('/api/photos')).status).toBe(400);
    expect((await otherAs.manager.get('/api/photos').query({ applianceId: boiler.id })).status).toBe(404);
    expect((await as.homeowner.get('/api/photos').query({ applianceId: boiler.id })).status).toBe(403);
    expect((await as.anonymous.get('/api/photos').query({ applianceId: boiler.id })).status).toBe(401);
  });
});

describe('refusing bad uploads, storing nothing', () => {
  const expectNothingStored = async () => {
    expect(await rowsFor(heaterId)).toHaveLength(0);
    expect(await ctx.storage.list(prefixOf(heaterId))).toHaveLength(0);
  };

  it('refuses a text file named .jpg, a truncated JPEG and a pixel-flood PNG', async () => {
    const cases = [
      { body: Buffer.from('these are not the pixels you are looking for\n'.repeat(50)), name: 'notes.jpg' },
      { body: gpsJpeg.subarray(0, Math.floor(gpsJpeg.length / 2)), name: 'cut-off.jpg' },
      { body: pixelFloodPng(), name: 'flood.png', type: 'image/png' },
    ];
    for (const file of cases) {
      const res = await send(as.technician, { applianceId: heaterId, kind: 'finding' }, [file]);
      expect({ name: file.name, status: res.status }).toEqual({ name: file.name, status: 422 });
      expect(res.body.error.details.files[0]).toContain(file.name);
      // Named as data, so the phone matches the refusal to its file without parsing a sentence.
      expect(res.body.error.files).toEqual([{ file: file.name, reason: res.body.error.message }]);
    }
    await expectNothingStored();
  });

  it('refuses the whole request when one file of several is bad', async () => {
    const res = await send(as.technician, { applianceId: heaterId, kind: 'finding' }, [
      { body: await solidJpeg(1, 2, 3), name: 'fine.jpg' },
      { body: Buffer.from('nope'), name: 'bad.jpg' },
    ]);
    expect(res.status).toBe(422);
    await expectNothingStored();
  });

  it('refuses a file over 25 MB with 413', async () => {
    const res = await send(as.technician, { applianceId: heaterId, kind: 'finding' }, [{ body: Buffer.alloc(25 * 1024 * 1024 + 1, 0xff), name: 'huge.jpg' }]);
    expect(res.status).toBe(413);
    expect(res.body.error.details).toHaveProperty('files');
    await expectNothingStored();
  });

  it('answers field errors for the form fields', async () => {
    const jpeg = [{ body: await solidJpeg(40, 40, 40), name: 'x.jpg' }];
    const bad = await send(as.technician, { applianceId: 'boiler-1', kind: 'selfie', homeownerVisible: 'maybe' }, jpeg);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['applianceId', 'homeownerVisible', 'kind']);
    const noFiles = await send(as.technician, { applianceId: heaterId, kind: 'finding' }, []);
    expect(noFiles.status).toBe(400);
    expect(Object.keys(noFiles.body.error.details)).toEqual(['files']);
    const wrongVisit = await send(as.technician, { applianceId: heaterId, visitId: boilerVisitId, kind: 'finding' }, jpeg);
    expect(wrongVisit.status).toBe(400);
    expect(Object.keys(wrongVisit.body.error.details)).toEqual(['visitId']);
    const wrongPart = await send(as.technician, { applianceId: heaterId, componentId: boiler.components[0].id, kind: 'finding' }, jpeg);
    expect(wrongPart.status).toBe(400);
    expect(Object.keys(wrongPart.body.error.details)).toEqual(['componentId']);
    await expectNothingStored();
  });

  it('404 for another company’s appliance or visit; 403 for a homeowner; 401 signed out', async () => {
    const jpeg = [{ body: await solidJpeg(50, 50, 50), name: 'x.jpg' }];
    expect((await send(as.technician, { applianceId: otherBoilerId, kind: 'finding' }, jpeg)).status).toBe(404);
    expect((await send(as.technician, { applianceId: heaterId, visitId: otherVisitId, kind: 'finding' }, jpeg)).status).toBe(404);
    expect((await send(as.homeowner, { applianceId: heaterId, kind: 'finding' }, jpeg)).status).toBe(403);
    expect((await send(as.anonymous as unknown as Agent, { applianceId: heaterId, kind: 'finding' }, jpeg)).status).toBe(401);
    await expectNothingStored();
    expect(await rowsFor(otherBoilerId)).toHaveLength(0);
    expect(await ctx.storage.list(prefixOf(otherBoilerId, other.company.id))).toHaveLength(0);
  });

  it('deletes the stored objects when the database write fails', async () => {
    const put = vi.spyOn(ctx.storage, 'put');
    const del = vi.spyOn(ctx.storage, 'delete');
    vi.spyOn(photosRepository, 'insert').mockRejectedValueOnce(new Error('simulated database failure'));
    const res = await send(as.technician, { applianceId: heaterId, visitId: heaterVisitId, kind: 'after' }, [{ body: await solidJpeg(200, 10, 10), name: 'x.jpg' }]);
    expect(res.status).toBe(500);
    const written = put.mock.calls.map((c) => c[0]);
    expect(written).toHaveLength(2);
    expect(del.mock.calls.map((c) => c[0]).sort()).toEqual([...written].sort());
    await expectNothingStored();
    expect(await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.applianceId, heaterId), eq(timelineEvents.kind, 'photo')))).toHaveLength(0);
  });
});

describe('sweeping orphaned objects', () => {
  it('deletes only unreferenced objects older than the cut-off', async () => {
    const stray = `${prefixOf(heaterId)}${crypto.randomUUID()}-display.jpg`;
    await ctx.storage.put(stray, await solidJpeg(9, 9, 9), 'image/jpeg');
    const prefix = `${t.company.id}/`;
    // Ages are read against the store's own time stamp, so the check holds whatever the two clocks say.
    const [{ lastModified }] = await ctx.storage.list(prefixOf(heaterId));
    const hoursAfterStoring = (h: number) => new Date(lastModified.getTime() + h * 3_600_000);
    expect(await sweepOrphanObjects(ctx, { olderThanHours: 24, prefix, now: hoursAfterStoring(23) })).toEqual({ deleted: [] });
    expect((await ctx.storage.list(prefixOf(heaterId))).map((o) => o.key)).toEqual([stray]);

    expect(await sweepOrphanObjects(ctx, { olderThanHours: 24, prefix, now: hoursAfterStoring(25) })).toEqual({ deleted: [stray] });
    expect(await ctx.storage.list(prefixOf(heaterId))).toHaveLength(0);
    // Every object of a stored photo is still there.
    const rows = await rowsFor(boiler.id);
    expect((await ctx.storage.list(prefixOf(boiler.id))).map((o) => o.key).sort()).toEqual(rows.flatMap((r) => [r.displayKey, r.thumbKey]).sort());
  });
});

describe('who may see a photo', () => {
  let visibleId: string;
  let hiddenId: string;
  let neighbourPhotoId: string;

  beforeAll(async () => {
    const rows = await rowsFor(boiler.id);
    visibleId = rows.find((r) => r.homeownerVisible)!.id;
    hiddenId = rows.find((r) => !r.homeownerVisible)!.id;
    const res = await send(as.technician, { applianceId: neighbourBoilerId, kind: 'after', homeownerVisible: 'true' }, [{ body: await solidJpeg(5, 6, 7), name: 'n.jpg' }]);
    neighbourPhotoId = res.body.photos[0].id;
  });

  it('lets a homeowner see their own appliance’s visible photos only', async () => {
    expect((await as.homeowner.get(`/api/photos/${visibleId}/display`)).status).toBe(200);
    expect((await as.homeowner.get(`/api/photos/${visibleId}/thumb`)).status).toBe(200);
    expect((await as.homeowner.get(`/api/photos/${hiddenId}/display`)).status).toBe(404);
    expect((await as.homeowner.get(`/api/photos/${neighbourPhotoId}/thumb`)).status).toBe(404);
    expect((await otherAs.homeowner.get(`/api/photos/${visibleId}/display`)).status).toBe(404);
  });

  it('answers 404 to another company and 401 signed out', async () => {
    expect((await otherAs.manager.get(`/api/photos/${visibleId}/display`)).status).toBe(404);
    expect((await otherAs.technician.get(`/api/photos/${hiddenId}/thumb`)).status).toBe(404);
    expect((await as.anonymous.get(`/api/photos/${visibleId}/display`)).status).toBe(401);
    expect((await as.manager.get(`/api/photos/${crypto.randomUUID()}/display`)).status).toBe(404);
  });

  it('hides a photo from the homeowner when the office unticks it, timeline entry included', async () => {
    const res = await as.manager.patch(`/api/photos/${visibleId}`).send({ homeownerVisible: false, caption: 'Rating plate (worn)' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: visibleId, homeownerVisible: false, caption: 'Rating plate (worn)' });
    const [row] = await ctx.db.select().from(photos).where(eq(photos.id, visibleId));
    expect(row).toMatchObject({ homeownerVisible: false, caption: 'Rating plate (worn)' });
    const [event] = await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.refId, visibleId), eq(timelineEvents.kind, 'photo')));
    expect(event.homeownerVisible).toBe(false);
    expect((await as.homeowner.get(`/api/photos/${visibleId}/display`)).status).toBe(404);
    expect(await ctx.db.select().from(auditLog).where(and(eq(auditLog.entity, 'photo'), eq(auditLog.entityId, visibleId), eq(auditLog.action, 'update')))).toHaveLength(1);
  });

  it('PATCH: 400 with nothing to change, 404 across companies, 403 for a homeowner, 401 signed out', async () => {
    const empty = await as.manager.patch(`/api/photos/${hiddenId}`).send({});
    expect(empty.status).toBe(400);
    expect(Object.keys(empty.body.error.details)).toEqual(['_']);
    expect((await as.manager.patch(`/api/photos/${hiddenId}`).send({ homeownerVisible: 'yes' })).status).toBe(400);
    expect((await otherAs.manager.patch(`/api/photos/${hiddenId}`).send({ caption: 'x' })).status).toBe(404);
    expect((await as.homeowner.patch(`/api/photos/${hiddenId}`).send({ homeownerVisible: true })).status).toBe(403);
    expect((await as.anonymous.patch(`/api/photos/${hiddenId}`).send({ caption: 'x' })).status).toBe(401);
    const [row] = await ctx.db.select().from(photos).where(eq(photos.id, hiddenId));
    expect(row).toMatchObject({ homeownerVisible: false, caption: null });
  });
});

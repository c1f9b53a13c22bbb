import { readFileSync } from 'node:fs';
import { Ajv2020 } from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import { eq } from 'drizzle-orm';
import { PDFDocument, PDFName, PDFDict } from 'pdf-lib';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { components, visits } from '../../server/db/schema/index';
import { lifeRecordJsonSchema } from '../../shared/schemas/life-record-export';
import { testApp } from '../support/context';
import { pdfPageText } from '../support/pdf-text';
import { runFileAt } from '../support/clock';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';
import { fullCompletion } from '../support/visit-completion';

const { app, ctx } = testApp();
runFileAt('2026-11-18T12:00:00-05:00');
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherAs: Awaited<ReturnType<typeof agentsFor>>;
let applianceId: string;
let token: string;
const SECRET_NOTE = 'Office only: gate code 4411';

const committed = JSON.parse(readFileSync('docs/schemas/life-record-export.v1.json', 'utf8'));
const ajv = new Ajv2020({ allErrors: true, strict: false });
(addFormats as unknown as (a: Ajv2020) => void)(ajv);
const validate = ajv.compile(committed);

const binary = (r: import('supertest').Request) =>
  r.buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  otherAs = await agentsFor(app, other);
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id, street: '5 Copperbeech Way', town: 'Wrenfield' });
  const appliance = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'hot_water_boiler', fuel: 'natural_gas', installedOn: '2010-09-01', serial: 'SN-EXPORT-771' });
  applianceId = appliance.id;
  const [tc] = await ctx.db
    .insert(components)
    .values({ companyId: t.company.id, applianceId, typeCode: 'thermocouple', spec: { lengthIn: 24 }, specKey: '24 in', installedOn: '2018-03-01' })
    .returning();
  const started = await as.technician.post('/api/visits').send({ applianceId, type: 'annual_maintenance' });
  const swapped = await as.technician.post(`/api/visits/${started.body.id}/swaps`).send({ componentId: tc.id, reason: 'Weak output', newDescription: 'thermocouple, 24 in' });
  const done = await as.technician
    .post(`/api/visits/${started.body.id}/complete`)
    .send(fullCompletion(swapped.body, { findings: 'Cleaned the burners.', internalNotes: SECRET_NOTE }));
  expect(done.status).toBe(200);
  // A visible photo and a hidden one.
  for (const visible of [true, false]) {
    // Different pictures: the same bytes twice would be one photo.
    const jpeg = await sharp({ create: { width: 80, height: 60, channels: 3, background: { r: visible ? 200 : 20, g: 90, b: 30 } } }).jpeg().toBuffer();
    const up = await as.technician
      .post('/api/photos')
      .field('applianceId', applianceId)
      .field('kind', 'nameplate')
      .field('homeownerVisible', String(visible))
      .field('caption', visible ? 'Rating plate' : 'Hidden photo')
      .attach('files', jpeg, { filename: 'plate.jpg', contentType: 'image/jpeg' });
    expect(up.status).toBe(201);
  }
  const link = await as.technician.post(`/api/appliances/${applianceId}/share-links`).send({});
  token = link.body.url.split('/s/')[1];
});
afterAll(() => ctx.pool.end());

describe('life-record export as JSON', () => {
  it('the committed JSON Schema is the one the zod schema generates', () => {
    expect(committed).toEqual(lifeRecordJsonSchema());
  });

  it('the office export validates against the committed schema and holds the whole record, never internal notes', async () => {
    const res = await as.manager.get(`/api/appliances/${applianceId}/life-record.json`);
    expect(res.status).toBe(200);
    expect(validate(res.body), JSON.stringify(validate.errors)).toBe(true);
    expect(res.body).toMatchObject({ format: 'lifeplate.life-record', version: 1, recordedBy: { name: t.company.name } });
    expect(res.body.appliance).toMatchObject({ kind: 'hot_water_boiler', serial: 'SN-EXPORT-771', address: '5 Copperbeech Way, Wrenfield', ageYears: 16 });
    const [visit] = res.body.visits;
    expect(visit).toMatchObject({ visitedOn: '2026-11-18', type: 'annual_maintenance', outcome: 'left_operating', findings: 'Cleaned the burners.' });
    expect(visit.partSwaps).toEqual([{ part: 'thermocouple', swappedOn: '2026-11-18', reason: 'Weak output', newDescription: 'thermocouple, 24 in' }]);
    expect(visit.readingsInWords[0]).toEqual({ reading: 'Carbon monoxide in the flue', value: '75 ppm air-free', meaning: 'well under the 400 ppm limit' });
    // The removed thermocouple: fitted 2018-03-01, removed 2026-11-18, 8 whole years.
    const removed = res.body.components.find((c: { removedOn: string | null }) => c.removedOn);
    expect(removed).toMatchObject({ typeCode: 'thermocouple', ageYears: 8, removedOn: '2026-11-18' });
    expect(res.body.photos.map((p: { caption: string }) => p.caption).sort()).toEqual(['Hidden photo', 'Rating plate']);
    expect(JSON.stringify(res.body)).not.toContain(SECRET_NOTE);
    // A broken document fails the schema: the check can fail.
    expect(validate({ ...res.body, version: 2 })).toBe(false);
    expect(validate({ ...res.body, visits: [{ ...visit, visitedOn: '18/11/2026' }] })).toBe(false);
  });

  it('the homeowner exports their own (visible photos only); the share link leaves the serial out', async () => {
    const mine = await as.homeowner.get(`/api/homeowner/appliances/${applianceId}/life-record.json`);
    expect(mine.status).toBe(200);
    expect(validate(mine.body)).toBe(true);
    expect(mine.body.photos.map((p: { caption: string }) => p.caption)).toEqual(['Rating plate']);
    const shared = await as.anonymous.get(`/api/share/${token}/life-record.json`);
    expect(shared.status).toBe(200);
    expect(validate(shared.body)).toBe(true);
    expect(shared.body.appliance.serial).toBeNull();
    expect(shared.headers['cache-control']).toBe('private, no-store');
  });

  it('answers 401, 403, 404 across tenants and for someone else’s appliance, 400 for a bad id', async () => {
    expect((await as.anonymous.get(`/api/appliances/${applianceId}/life-record.json`)).status).toBe(401);
    expect((await as.homeowner.get(`/api/appliances/${applianceId}/life-record.json`)).status).toBe(403);
    const foreign = await otherAs.manager.get(`/api/appliances/${applianceId}/life-record.json`);
    expect(foreign.status).toBe(404);
    expect(JSON.stringify(foreign.body)).not.toContain('Copperbeech');
    expect((await otherAs.manager.get(`/api/appliances/${applianceId}/life-record.pdf`)).status).toBe(404);
    expect((await otherAs.homeowner.get(`/api/homeowner/appliances/${applianceId}/life-record.json`)).status).toBe(404);
    expect((await as.anonymous.get(`/api/share/${'A'.repeat(43)}/life-record.pdf`)).status).toBe(404);
    const bad = await as.manager.get('/api/appliances/nope/life-record.json');
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details)).toEqual(['id']);
  });
});

describe('life-record export as PDF', () => {
  it('holds the nameplate, parts with ages, every visit and the photo thumbnails', async () => {
    const res = await binary(as.manager.get(`/api/appliances/${applianceId}/life-record.pdf`));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const doc = await PDFDocument.load(res.body as Buffer);
    const text = doc.getPages().map(pdfPageText).join('\n').replace(/\n/g, ' ');
    expect(text).toContain('Life record: Hot-water boiler, natural gas');
    expect(text).toContain('Serial: SN-EXPORT-771');
    expect(text).toContain('thermocouple: 8 years old when removed; removed November 18, 2026 (Weak output).');
    expect(text).toContain('thermocouple (thermocouple, 24 in): 0 years old; check by November 18, 2027.');
    expect(text).toContain('November 18, 2026: Annual maintenance, left operating');
    expect(text).toContain('Carbon monoxide in the flue: 75 ppm air-free, well under the 400 ppm limit.');
    expect(text).not.toContain(SECRET_NOTE);
    // Two photos, two embedded images.
    const images = doc.getPages().flatMap((p) => {
      const xobjects = p.node.Resources()?.lookupMaybe(PDFName.of('XObject'), PDFDict);
      return xobjects ? xobjects.keys() : [];
    });
    expect(images).toHaveLength(2);

    const shared = await binary(as.anonymous.get(`/api/share/${token}/life-record.pdf`));
    expect(shared.status).toBe(200);
    const sharedText = (await PDFDocument.load(shared.body as Buffer)).getPages().map(pdfPageText).join(' ');
    expect(sharedText).not.toContain('SN-EXPORT-771');
  });
});

it('stores nothing when exporting', async () => {
  const before = await ctx.db.select().from(visits).where(eq(visits.applianceId, applianceId));
  await as.manager.get(`/api/appliances/${applianceId}/life-record.json`);
  expect(await ctx.db.select().from(visits).where(eq(visits.applianceId, applianceId))).toEqual(before);
});

import { and, eq } from 'drizzle-orm';
import { PDFDocument } from 'pdf-lib';
import type { Response } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, customers, tags, timelineEvents, visits } from '../../server/db/schema/index';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { tagsService } from '../../server/modules/tags/tags.service';
import { checkCharacter, checkTagCode, formatTagCode, generateTagCode, TAG_ALPHABET } from '../../shared/tags/tag-code';
import { testApp } from '../support/context';
import { pdfPageText } from '../support/pdf-text';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherAs: Awaited<ReturnType<typeof agentsFor>>;
let site: Awaited<ReturnType<typeof insertSite>>;
let boiler: Awaited<ReturnType<typeof insertAppliance>>;
let heater: Awaited<ReturnType<typeof insertAppliance>>;
let neighbourBoilerId: string;
let otherBoilerId: string;
let codes: string[];
let batchId: string;
let otherCodes: string[];

const binary = (res: Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};
const tagRow = async (code: string) => (await ctx.db.select().from(tags).where(eq(tags.code, code)))[0];
/** A code that checks out but was never made. */
function unusedCode() {
  const body = 'W'.repeat(7);
  return body + checkCharacter(body);
}

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  // The customer's own phone differs from the company's, so a leak would show.
  await ctx.db.update(customers).set({ phone: '555-7781' }).where(eq(customers.id, t.customer.id));
  [as, otherAs] = await Promise.all([agentsFor(app, t), agentsFor(app, other)]);
  site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id, street: '14 Quarry Lane' });
  boiler = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, serial: 'QX7731ZZ01' });
  heater = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'water_heater' });
  const neighbour = await insertCustomer(ctx.db, { companyId: t.company.id });
  const neighbourSite = await insertSite(ctx.db, { companyId: t.company.id, customerId: neighbour.id });
  neighbourBoilerId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: neighbourSite.id })).id;
  const otherSite = await insertSite(ctx.db, { companyId: other.company.id, customerId: other.customer.id });
  otherBoilerId = (await insertAppliance(ctx.db, { companyId: other.company.id, siteId: otherSite.id })).id;
});
afterAll(() => ctx.pool.end());

describe('tag batches', () => {
  it('makes a batch of unassigned tags with valid, unique codes', async () => {
    const res = await as.manager.post('/api/tag-batches').send({ count: 31, format: 'sheet_1x2_625' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ count: 31, format: 'sheet_1x2_625', assignedCount: 0 });
    codes = res.body.codes;
    batchId = res.body.id;
    expect(new Set(codes).size).toBe(31);
    for (const code of codes) expect(checkTagCode(code)).toEqual({ ok: true, code });
    const stored = await ctx.db.select().from(tags).where(eq(tags.batchId, batchId));
    expect(stored).toHaveLength(31);
    expect(new Set(stored.map((r) => r.status))).toEqual(new Set(['unassigned']));
    expect(stored.every((r) => r.companyId === t.company.id && r.applianceId === null)).toBe(true);

    const otherRes = await otherAs.owner.post('/api/tag-batches').send({ count: 2, format: 'single_large' });
    expect(otherRes.status).toBe(201);
    otherCodes = otherRes.body.codes;
  });

  it('lists only the company’s own batches', async () => {
    const res = await as.owner.get('/api/tag-batches');
    expect(res.status).toBe(200);
    expect(res.body.map((b: { id: string }) => b.id)).toEqual([batchId]);
    expect(res.body[0]).toMatchObject({ count: 31, assignedCount: 0, createdByName: t.manager.user.name });
  });

  it('retries when a generated code is already taken', async () => {
    const taken = codes[0];
    const fresh = [generateTagCode(), generateTagCode()];
    const sequence = [taken, fresh[0], fresh[1]];
    const service = tagsService(ctx, () => sequence.shift() ?? generateTagCode());
    const batch = await service.createBatch({ kind: 'member', userId: t.manager.user.id, companyId: t.company.id, role: 'manager' }, { count: 2, format: 'single_large' });
    expect(batch.codes?.sort()).toEqual([...fresh].sort());
    expect((await tagRow(taken)).batchId).toBe(batchId);
  });

  it('answers field errors for a bad count or format', async () => {
    for (const body of [{ count: 0, format: 'sheet_1x2_625' }, { count: 301, format: 'sheet_1x2_625' }, { count: 2.5, format: 'sheet_1x2_625' }]) {
      const res = await as.manager.post('/api/tag-batches').send(body);
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.details)).toEqual(['count']);
    }
    const res = await as.manager.post('/api/tag-batches').send({ count: 3, format: 'poster' });
    expect(Object.keys(res.body.error.details)).toEqual(['format']);
  });

  it('prints the batch as a PDF whose every code resolves', async () => {
    const res = await as.manager.get(`/api/tag-batches/${batchId}/pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = await PDFDocument.load(res.body as Buffer);
    expect(pdf.getPageCount()).toBe(2); // 31 tags at 30 a sheet
    const text = pdf.getPages().map(pdfPageText).join('');
    const printed = [...text.matchAll(new RegExp(`^[${TAG_ALPHABET}]{4}-[${TAG_ALPHABET}]{4}$`, 'gm'))].map((m) => m[0]);
    expect(printed).toHaveLength(31);
    expect(text).toContain(t.company.name);
    for (const p of printed) {
      const resolved = await as.technician.get(`/api/tags/${p}/resolve`);
      expect({ p, status: resolved.status, body: resolved.body }).toEqual({ p, status: 200, body: { status: 'unassigned' } });
    }
    expect(printed.map((p) => p.replace('-', '')).sort()).toEqual([...codes].sort());
  });

  it('401 signed out, 403 for technicians and homeowners, 404 for another company’s batch', async () => {
    expect((await as.anonymous.get('/api/tag-batches')).status).toBe(401);
    expect((await as.anonymous.post('/api/tag-batches').send({ count: 1, format: 'single_large' })).status).toBe(401);
    expect((await as.technician.post('/api/tag-batches').send({ count: 1, format: 'single_large' })).status).toBe(403);
    expect((await as.homeowner.get('/api/tag-batches')).status).toBe(403);
    expect((await as.technician.get(`/api/tag-batches/${batchId}/pdf`)).status).toBe(403);
    expect((await otherAs.manager.get(`/api/tag-batches/${batchId}/pdf`)).status).toBe(404);
  });
});

describe('attaching a tag', () => {
  it('attaches a code typed in lower case with a dash, with a timeline note and an audit row', async () => {
    const res = await as.technician.post('/api/tags/assign').send({ code: formatTagCode(codes[1]).toLowerCase(), applianceId: boiler.id });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ code: codes[1], status: 'assigned', applianceId: boiler.id });
    const row = await tagRow(codes[1]);
    expect(row).toMatchObject({ status: 'assigned', applianceId: boiler.id, assignedBy: t.technician.user.id });
    const events = await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.applianceId, boiler.id), eq(timelineEvents.kind, 'note')));
    expect(events.map((e) => e.summary)).toEqual([`Tag ${formatTagCode(codes[1])} attached`]);
    const audits = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entity, 'tag'), eq(auditLog.entityId, row.id)));
    expect(audits).toHaveLength(1);
  });

  it('refuses to move an attached tag to another appliance (409) and changes nothing', async () => {
    const res = await as.technician.post('/api/tags/assign').send({ code: codes[1], applianceId: heater.id });
    expect(res.status).toBe(409);
    expect((await tagRow(codes[1])).applianceId).toBe(boiler.id);
  });

  it('refuses a second tag on the same appliance unless the first is replaced as damaged', async () => {
    const refused = await as.technician.post('/api/tags/assign').send({ code: codes[2], applianceId: boiler.id });
    expect(refused.status).toBe(409);
    expect(Object.keys(refused.body.error.details)).toEqual(['replaceDamaged']);
    expect((await tagRow(codes[2])).status).toBe('unassigned');

    const replaced = await as.technician.post('/api/tags/assign').send({ code: codes[2], applianceId: boiler.id, replaceDamaged: true });
    expect(replaced.status).toBe(200);
    const [oldTag, newTag] = [await tagRow(codes[1]), await tagRow(codes[2])];
    expect(oldTag).toMatchObject({ status: 'retired', applianceId: boiler.id, retiredNote: 'replaced: damaged', replacedByTagId: newTag.id });
    expect(newTag).toMatchObject({ status: 'assigned', applianceId: boiler.id });
  });

  it('keeps a retired code opening the same appliance, and never another', async () => {
    const old = await as.technician.get(`/api/tags/${codes[1]}/resolve`);
    expect(old.status).toBe(200);
    expect(old.body).toEqual({ status: 'retired', applianceId: boiler.id, retiredNote: 'replaced: damaged' });
    const current = await as.manager.get(`/api/tags/${formatTagCode(codes[2])}/resolve`);
    expect(current.body).toEqual({ status: 'assigned', applianceId: boiler.id });

    const reuse = await as.technician.post('/api/tags/assign').send({ code: codes[1], applianceId: heater.id });
    expect(reuse.status).toBe(409);
    expect(await tagRow(codes[1])).toMatchObject({ status: 'retired', applianceId: boiler.id });
  });

  it('answers 400 with the reason for a mistyped code', async () => {
    const typo = codes[3].slice(0, 7) + TAG_ALPHABET[(TAG_ALPHABET.indexOf(codes[3][7]) + 1) % TAG_ALPHABET.length];
    const res = await as.technician.post('/api/tags/assign').send({ code: typo, applianceId: heater.id });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual({ code: ['This code does not check out: a character is mistyped.'] });
    const withO = await as.technician.post('/api/tags/assign').send({ code: `O${codes[3].slice(1)}`, applianceId: heater.id });
    expect(withO.body.error.details.code[0]).toMatch(/'O' never appears in a tag code/);
    const short = await as.technician.get('/api/tags/ABC/resolve');
    expect(short.status).toBe(400);
    expect(short.body.error.details).toEqual({ code: ['A tag code has 8 characters.'] });
  });

  it('404 for another company’s tag or appliance, or an unknown code', async () => {
    expect((await as.technician.post('/api/tags/assign').send({ code: otherCodes[0], applianceId: heater.id })).status).toBe(404);
    expect((await as.technician.post('/api/tags/assign').send({ code: codes[4], applianceId: otherBoilerId })).status).toBe(404);
    expect((await as.technician.post('/api/tags/assign').send({ code: unusedCode(), applianceId: heater.id })).status).toBe(404);
    expect((await tagRow(otherCodes[0])).status).toBe('unassigned');
    expect((await tagRow(codes[4])).status).toBe('unassigned');
  });

  it('401 signed out and 403 for a homeowner', async () => {
    expect((await as.anonymous.post('/api/tags/assign').send({ code: codes[4], applianceId: heater.id })).status).toBe(401);
    expect((await as.homeowner.post('/api/tags/assign').send({ code: codes[4], applianceId: heater.id })).status).toBe(403);
    expect((await tagRow(codes[4])).status).toBe('unassigned');
  });
});

describe('resolving a scanned tag', () => {
  it('shows the homeowner their own appliance and nothing about a neighbour’s', async () => {
    const own = await as.homeowner.get(`/api/tags/${codes[2]}/resolve`);
    expect(own.status).toBe(200);
    expect(own.body).toEqual({ applianceId: boiler.id, homeowner: true });
    expect((await as.technician.post('/api/tags/assign').send({ code: codes[5], applianceId: neighbourBoilerId })).status).toBe(200);
    expect((await as.homeowner.get(`/api/tags/${codes[5]}/resolve`)).status).toBe(404);
    // An unassigned tag is not the homeowner's business either.
    expect((await as.homeowner.get(`/api/tags/${codes[6]}/resolve`)).status).toBe(404);
  });

  it('answers 404 to everyone outside the company, and 401 signed out', async () => {
    expect((await otherAs.manager.get(`/api/tags/${codes[2]}/resolve`)).status).toBe(404);
    expect((await otherAs.homeowner.get(`/api/tags/${codes[2]}/resolve`)).status).toBe(404);
    expect((await as.manager.get(`/api/tags/${otherCodes[0]}/resolve`)).status).toBe(404);
    expect((await as.manager.get(`/api/tags/${unusedCode()}/resolve`)).status).toBe(404);
    expect((await as.anonymous.get(`/api/tags/${codes[2]}/resolve`)).status).toBe(401);
  });
});

describe('the public tag page', () => {
  it('gives only the company’s name and phone, never the home’s details', async () => {
    const res = await as.anonymous.get(`/api/public/tags/${codes[2]}`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ known: true, companyName: t.company.name, companyPhone: t.company.phone });
    const raw = JSON.stringify(res.body);
    for (const secret of [t.customer.name, '555-7781', '14 Quarry Lane', site.town, 'QX7731ZZ01', boiler.id, t.customer.id]) expect(raw).not.toContain(secret);
  });

  it('says nothing about whose tag an unknown code would be', async () => {
    const res = await as.anonymous.get(`/api/public/tags/${unusedCode()}`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ known: false, companyName: null, companyPhone: null });
    expect((await as.anonymous.get('/api/public/tags/NOT-A-CODE')).status).toBe(400);
  });
});

describe('arriving by tag', () => {
  it('starts a visit on the tagged appliance with the arrival time', async () => {
    const before = Date.now();
    const res = await as.technician.post('/api/visits/arrive-by-tag').send({ code: formatTagCode(codes[2]) });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ applianceId: boiler.id, status: 'draft', type: 'annual_maintenance' });
    const [row] = await ctx.db.select().from(visits).where(eq(visits.id, res.body.id));
    expect(row.arrivedAt!.getTime()).toBeGreaterThanOrEqual(before - 1000);
    expect(row.technicianIds).toEqual([t.technician.user.id]);
  });

  it('refuses an unattached tag (409), another company’s tag (404) and a homeowner (403)', async () => {
    expect((await as.technician.post('/api/visits/arrive-by-tag').send({ code: codes[7] })).status).toBe(409);
    expect((await as.technician.post('/api/visits/arrive-by-tag').send({ code: otherCodes[0] })).status).toBe(404);
    expect((await as.homeowner.post('/api/visits/arrive-by-tag').send({ code: codes[2] })).status).toBe(403);
    expect((await as.anonymous.post('/api/visits/arrive-by-tag').send({ code: codes[2] })).status).toBe(401);
  });
});

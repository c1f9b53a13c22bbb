import crypto from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { idempotencyKeys, partSwaps, photos, visits } from '../../server/db/schema/index';
import { IDEMPOTENCY_KEY_TTL_HOURS, sweepIdempotencyKeys } from '../../server/lib/idempotency/sweep-idempotency-keys';
import { requestFingerprint } from '../../server/lib/idempotency/fingerprint';
import { STALE_CLAIM_MS } from '../../server/lib/idempotency/idempotency-middleware';
import { runFileAt } from '../support/clock';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Agent, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
const START = '2026-06-10T12:00:00-04:00';
runFileAt(START);
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherAs: Awaited<ReturnType<typeof agentsFor>>;

const key = () => crypto.randomUUID();
const keyRows = (tenant: Tenant, k: string) => ctx.db.select().from(idempotencyKeys).where(and(eq(idempotencyKeys.companyId, tenant.company.id), eq(idempotencyKeys.key, k)));
const visitRows = (applianceId: string) => ctx.db.select().from(visits).where(eq(visits.applianceId, applianceId));
const swapRows = (visitId: string) => ctx.db.select().from(partSwaps).where(eq(partSwaps.visitId, visitId));

async function boilerWithThermocouple(tenant = t) {
  const site = await insertSite(ctx.db, { companyId: tenant.company.id, customerId: tenant.customer.id });
  return insertAppliance(ctx.db, { companyId: tenant.company.id, siteId: site.id, components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 } }] });
}
async function startedVisit(agent: Agent = as.technician) {
  const boiler = await boilerWithThermocouple();
  const res = await agent.post('/api/visits').send({ applianceId: boiler.id, type: 'repair' });
  expect(res.status).toBe(200);
  return { boiler, visitId: res.body.id as string, thermocoupleId: boiler.components[0].id };
}
const swap = (agent: Agent, visitId: string, body: object, k?: string) => {
  const req = agent.post(`/api/visits/${visitId}/swaps`);
  return (k === undefined ? req : req.set('Idempotency-Key', k)).send(body);
};

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  [as, otherAs] = await Promise.all([agentsFor(app, t), agentsFor(app, other)]);
});
afterAll(async () => {
  ctx.storage.destroy();
  await ctx.pool.end();
});

describe('a write sent twice with one Idempotency-Key', () => {
  it('writes once and answers the repeat with the first answer, marked as replayed', async () => {
    const { visitId, thermocoupleId } = await startedVisit();
    const k = key();
    const body = { componentId: thermocoupleId, reason: 'Weak output', newSpec: { lengthIn: 30 }, newDescription: 'thermocouple, 30 in' };
    const first = await swap(as.technician, visitId, body, k);
    expect(first.status).toBe(200);
    expect(first.headers['idempotent-replayed']).toBeUndefined();
    // Keys in another order are the same request.
    const again = await swap(as.technician, visitId, { newDescription: 'thermocouple, 30 in', newSpec: { lengthIn: 30 }, reason: 'Weak output', componentId: thermocoupleId }, k);
    expect(again.status).toBe(200);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    expect(await swapRows(visitId)).toHaveLength(1);
    const [row] = await keyRows(t, k);
    expect(row).toMatchObject({ userId: t.technician.user.id, method: 'POST', path: `/api/visits/${visitId}/swaps`, status: 'done', responseStatus: 200 });
    expect(row.responseBody).toEqual(first.body);
    expect(row.fingerprint).toMatch(/^[0-9a-f]{64}$/);
    expect(row.createdAt.getTime()).toBeGreaterThanOrEqual(new Date(START).getTime());
  });

  it('starts one visit when POST /visits is replayed', async () => {
    const boiler = await boilerWithThermocouple();
    const k = key();
    const send = () => as.technician.post('/api/visits').set('Idempotency-Key', k).send({ applianceId: boiler.id, type: 'repair' });
    const first = await send();
    const again = await send();
    expect([first.status, again.status]).toEqual([200, 200]);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    expect(await visitRows(boiler.id)).toHaveLength(1);
  });

  it('lets exactly one of two concurrent requests write; the other is replayed or told the first is in progress', async () => {
    const { visitId, thermocoupleId } = await startedVisit();
    const k = key();
    const body = { componentId: thermocoupleId, reason: 'No spark', newDescription: 'thermocouple, 24 in' };
    const answers = await Promise.all([swap(as.technician, visitId, body, k), swap(as.technician, visitId, body, k)]);
    expect(await swapRows(visitId)).toHaveLength(1);
    const statuses = answers.map((a) => a.status).sort();
    expect([[200, 200], [200, 409]]).toContainEqual(statuses);
    const refused = answers.find((a) => a.status === 409);
    if (refused) expect(refused.body.error.code).toBe('idempotency_key_in_progress');
    else expect(answers[0].body).toEqual(answers[1].body);
    expect((await keyRows(t, k))[0].status).toBe('done');
  });

  it('refuses the key with a different request (422) and writes nothing', async () => {
    const [a, b] = [await boilerWithThermocouple(), await boilerWithThermocouple()];
    const k = key();
    expect((await as.technician.post('/api/visits').set('Idempotency-Key', k).send({ applianceId: a.id, type: 'repair' })).status).toBe(200);
    const reused = await as.technician.post('/api/visits').set('Idempotency-Key', k).send({ applianceId: b.id, type: 'repair' });
    expect(reused.status).toBe(422);
    expect(reused.body.error.code).toBe('idempotency_key_reused');
    expect(reused.body.error.details['Idempotency-Key'][0]).toContain('POST /api/visits');
    expect(await visitRows(b.id)).toHaveLength(0);
    expect((await keyRows(t, k))[0].fingerprint).toBeDefined();
  });

  it('keeps keys per user and company: the same key from someone else is their own', async () => {
    const boiler = await boilerWithThermocouple();
    const k = key();
    const body = { applianceId: boiler.id, type: 'repair' };
    const tech = await as.technician.post('/api/visits').set('Idempotency-Key', k).send(body);
    const manager = await as.manager.post('/api/visits').set('Idempotency-Key', k).send(body);
    expect([tech.status, manager.status]).toEqual([200, 200]);
    expect(manager.headers['idempotent-replayed']).toBeUndefined();
    expect(manager.body.id).not.toBe(tech.body.id);
    expect(await visitRows(boiler.id)).toHaveLength(2);
    const otherBoiler = await boilerWithThermocouple(other);
    const foreign = await otherAs.technician.post('/api/visits').set('Idempotency-Key', k).send({ applianceId: otherBoiler.id, type: 'repair' });
    expect(foreign.status).toBe(200);
    expect(await keyRows(t, k)).toHaveLength(2);
    expect(await keyRows(other, k)).toHaveLength(1);
  });
});

describe('a claim left in progress by a request that never finished', () => {
  it('answers 409 while it is recent, and is taken over once it is older than any request may run', async () => {
    const { visitId, thermocoupleId } = await startedVisit();
    const body = { componentId: thermocoupleId, reason: 'Weak output', newDescription: 'thermocouple, 24 in' };
    const path = `/api/visits/${visitId}/swaps`;
    const claimAged = (k: string, ageMs: number) =>
      ctx.db.insert(idempotencyKeys).values({
        companyId: t.company.id,
        userId: t.technician.user.id,
        key: k,
        method: 'POST',
        path,
        fingerprint: requestFingerprint({ method: 'POST', path, body }),
        status: 'in_progress',
        createdAt: new Date(Date.now() - ageMs),
      });

    const recent = key();
    await claimAged(recent, 60_000);
    const busy = await swap(as.technician, visitId, body, recent);
    expect(busy.status).toBe(409);
    expect(busy.body.error.code).toBe('idempotency_key_in_progress');
    expect(await swapRows(visitId)).toHaveLength(0);

    const abandoned = key();
    await claimAged(abandoned, STALE_CLAIM_MS + 60_000);
    const taken = await swap(as.technician, visitId, body, abandoned);
    expect(taken.status).toBe(200);
    expect(await swapRows(visitId)).toHaveLength(1);
    expect((await keyRows(t, abandoned))[0]).toMatchObject({ status: 'done', responseStatus: 200 });
  });
});

describe('a failed request under a key', () => {
  it('is not stored: a 400 and a 404 leave no row, and the corrected request under the same key writes', async () => {
    const { visitId, thermocoupleId } = await startedVisit();
    const k = key();
    const bad = await swap(as.technician, visitId, { componentId: 'not-a-part' }, k);
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.componentId).toBeDefined();
    expect(await keyRows(t, k)).toHaveLength(0);
    const missing = await swap(as.technician, visitId, { componentId: crypto.randomUUID() }, k);
    expect(missing.status).toBe(404);
    expect(await keyRows(t, k)).toHaveLength(0);
    const fixed = await swap(as.technician, visitId, { componentId: thermocoupleId, newDescription: 'thermocouple, 24 in' }, k);
    expect(fixed.status).toBe(200);
    expect(fixed.headers['idempotent-replayed']).toBeUndefined();
    expect(await swapRows(visitId)).toHaveLength(1);
    expect((await keyRows(t, k))[0]).toMatchObject({ status: 'done', responseStatus: 200 });
  });

  it('refuses a malformed key with a field error on Idempotency-Key, before any write', async () => {
    const boiler = await boilerWithThermocouple();
    for (const bad of ['', '""', 'x'.repeat(256), 'key\u00e9']) {
      const res = await as.technician.post('/api/visits').set('Idempotency-Key', bad).send({ applianceId: boiler.id, type: 'repair' });
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
      expect(res.body.error.details['Idempotency-Key']).toHaveLength(1);
    }
    expect(await visitRows(boiler.id)).toHaveLength(0);
    const longest = 'k'.repeat(255);
    expect((await as.technician.post('/api/visits').set('Idempotency-Key', longest).send({ applianceId: boiler.id, type: 'repair' })).status).toBe(200);
    expect(await keyRows(t, longest)).toHaveLength(1);
  });

  it('answers 401 without a session and stores nothing', async () => {
    const boiler = await boilerWithThermocouple();
    const k = key();
    const res = await as.anonymous.post('/api/visits').set('Idempotency-Key', k).send({ applianceId: boiler.id, type: 'repair' });
    expect(res.status).toBe(401);
    expect(await ctx.db.select().from(idempotencyKeys).where(eq(idempotencyKeys.key, k))).toHaveLength(0);
  });
});

describe('expiry', () => {
  it(`sweeps keys older than ${IDEMPOTENCY_KEY_TTL_HOURS} h, after which the key is fresh`, async () => {
    const [a, b] = [await boilerWithThermocouple(), await boilerWithThermocouple()];
    const k = key();
    const sentAt = Date.now();
    expect((await as.technician.post('/api/visits').set('Idempotency-Key', k).send({ applianceId: a.id, type: 'repair' })).status).toBe(200);

    vi.setSystemTime(sentAt + (IDEMPOTENCY_KEY_TTL_HOURS - 1) * 3600_000);
    await sweepIdempotencyKeys(ctx.db);
    expect(await keyRows(t, k)).toHaveLength(1);

    vi.setSystemTime(sentAt + (IDEMPOTENCY_KEY_TTL_HOURS * 3600 + 60) * 1000);
    const { deleted } = await sweepIdempotencyKeys(ctx.db);
    expect(deleted).toBeGreaterThanOrEqual(1);
    expect(await keyRows(t, k)).toHaveLength(0);
    const fresh = await as.technician.post('/api/visits').set('Idempotency-Key', k).send({ applianceId: b.id, type: 'repair' });
    expect(fresh.status).toBe(200);
    expect(fresh.headers['idempotent-replayed']).toBeUndefined();
    expect(await visitRows(b.id)).toHaveLength(1);
    vi.setSystemTime(new Date(START));
  });
});

describe('a visit started with an id the phone chose', () => {
  it('is created under that id once; the same start again answers the same visit with 200', async () => {
    const boiler = await boilerWithThermocouple();
    const id = crypto.randomUUID();
    const first = await as.technician.post('/api/visits').send({ id, applianceId: boiler.id, type: 'repair' });
    expect(first.status).toBe(200);
    expect(first.body.id).toBe(id);
    const again = await as.technician.post('/api/visits').send({ id, applianceId: boiler.id, type: 'repair' });
    expect(again.status).toBe(200);
    expect(again.body).toEqual(first.body);
    const rows = await visitRows(boiler.id);
    expect(rows.map((r) => r.id)).toEqual([id]);
  });

  it('answers 409 for an id already used for another appliance, another technician or another company, without showing it', async () => {
    const [mine, second] = [await boilerWithThermocouple(), await boilerWithThermocouple()];
    const id = crypto.randomUUID();
    expect((await as.technician.post('/api/visits').send({ id, applianceId: mine.id, type: 'repair' })).status).toBe(200);
    const elsewhere = await as.technician.post('/api/visits').send({ id, applianceId: second.id, type: 'repair' });
    expect(elsewhere.status).toBe(409);
    expect(elsewhere.body.error.details.id).toHaveLength(1);
    expect(await visitRows(second.id)).toHaveLength(0);
    expect((await as.manager.post('/api/visits').send({ id, applianceId: mine.id, type: 'repair' })).status).toBe(409);

    const otherBoiler = await boilerWithThermocouple(other);
    const foreign = await otherAs.technician.post('/api/visits').send({ id, applianceId: otherBoiler.id, type: 'repair' });
    expect(foreign.status).toBe(409);
    expect(JSON.stringify(foreign.body)).not.toContain(mine.id);
    expect(JSON.stringify(foreign.body)).not.toContain(t.company.id);
    expect(await visitRows(otherBoiler.id)).toHaveLength(0);
    expect((await ctx.db.select().from(visits).where(eq(visits.id, id)))[0].companyId).toBe(t.company.id);
  });

  it('refuses an id that is not a UUID with a field error', async () => {
    const boiler = await boilerWithThermocouple();
    const res = await as.technician.post('/api/visits').send({ id: 'phone-1', applianceId: boiler.id, type: 'repair' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.id).toEqual(['Not a valid visit id.']);
  });
});

describe('a photo upload under a key', () => {
  it('stores one photo and replays the first answer', async () => {
    const boiler = await boilerWithThermocouple();
    const jpeg = await sharp({ create: { width: 200, height: 120, channels: 3, background: { r: 40, g: 90, b: 160 } } }).jpeg().toBuffer();
    const k = key();
    const upload = () =>
      as.technician
        .post('/api/photos')
        .set('Idempotency-Key', k)
        .field('applianceId', boiler.id)
        .field('kind', 'nameplate')
        .attach('files', jpeg, { filename: 'plate.jpg', contentType: 'image/jpeg' });
    const first = await upload();
    expect(first.status).toBe(201);
    const again = await upload();
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    expect(await ctx.db.select().from(photos).where(eq(photos.applianceId, boiler.id))).toHaveLength(1);

    const otherFile = await sharp({ create: { width: 200, height: 120, channels: 3, background: { r: 160, g: 90, b: 40 } } }).jpeg().toBuffer();
    const changed = await as.technician
      .post('/api/photos')
      .set('Idempotency-Key', k)
      .field('applianceId', boiler.id)
      .field('kind', 'nameplate')
      .attach('files', otherFile, { filename: 'plate.jpg', contentType: 'image/jpeg' });
    expect(changed.status).toBe(422);
    expect(await ctx.db.select().from(photos).where(eq(photos.applianceId, boiler.id))).toHaveLength(1);
  });
});

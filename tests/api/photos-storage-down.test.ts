import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { startFakeS3 } from '../../fakes/s3';
import { auditLog, photos, timelineEvents } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { sweepOrphanObjects } from '../../server/modules/photos/sweep-orphan-objects';
import { testApp } from '../support/context';
import { freePort } from '../support/global-setup';
import { agentsFor, createTenant, type Agent, type Tenant } from '../support/tenant';

// A photo store of this file's own, so stopping it leaves every other test file's store running.
const BUCKET = 'lifeplate-storage-down';
const s3Dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-s3-down-'));
let port: number;
let s3: Awaited<ReturnType<typeof startFakeS3>> | null = null;
let setup: ReturnType<typeof testApp>;
let t: Tenant;
let technician: Agent;
let applianceId: string;

const startStore = async () => {
  s3 = await startFakeS3({ port, directory: s3Dir, bucket: BUCKET });
};
const stopStore = async () => {
  await s3?.close();
  s3 = null;
};
const jpeg = (r: number) => sharp({ create: { width: 400, height: 300, channels: 3, background: { r, g: 60, b: 90 } } }).jpeg().toBuffer();
const upload = async (r: number) =>
  technician.post('/api/photos').field('applianceId', applianceId).field('kind', 'finding').attach('files', await jpeg(r), { filename: 'find.jpg', contentType: 'image/jpeg' });
const stored = () => setup.ctx.storage.list(`${t.company.id}/${applianceId}/`);

async function nothingRecorded() {
  const { db } = setup.ctx;
  expect(await db.select().from(photos).where(eq(photos.applianceId, applianceId))).toEqual([]);
  expect(await db.select().from(timelineEvents).where(and(eq(timelineEvents.applianceId, applianceId), eq(timelineEvents.kind, 'photo')))).toEqual([]);
  expect(await db.select().from(auditLog).where(and(eq(auditLog.companyId, t.company.id), eq(auditLog.entity, 'photo')))).toEqual([]);
}

beforeAll(async () => {
  port = await freePort();
  await startStore();
  setup = testApp({ S3_ENDPOINT: `http://127.0.0.1:${port}`, S3_BUCKET: BUCKET });
  t = await createTenant(setup.ctx.db);
  technician = (await agentsFor(setup.app, t)).technician;
  const site = await insertSite(setup.ctx.db, { companyId: t.company.id, customerId: t.customer.id });
  applianceId = (await insertAppliance(setup.ctx.db, { companyId: t.company.id, siteId: site.id })).id;
});
afterEach(() => {
  vi.restoreAllMocks();
});
afterAll(async () => {
  await stopStore();
  setup.ctx.storage.destroy();
  await setup.ctx.pool.end();
  fs.rmSync(s3Dir, { recursive: true, force: true });
});

describe('photo upload while the photo store is down', () => {
  it('answers 503 with a retry time and stores nothing when the store cannot be reached', async () => {
    await stopStore();
    const res = await upload(10);
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('unavailable');
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    await nothingRecorded();
    await startStore();
    expect(await stored()).toEqual([]);
  });

  it('leaves no half-stored photo when the store goes down between the two images, and the sweep clears what was left', async () => {
    const put = setup.ctx.storage.put.bind(setup.ctx.storage);
    // The display image reaches the store; then the store stops, so the thumbnail and the clean-up both fail.
    vi.spyOn(setup.ctx.storage, 'put').mockImplementationOnce(async (...args) => {
      await put(...args);
      await stopStore();
    });
    const res = await upload(20);
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('unavailable');
    await nothingRecorded();

    await startStore();
    const left = await stored();
    expect(left).toHaveLength(1);
    expect(left[0].key).toMatch(/-display\.jpg$/);
    // The sweep touches only objects older than an upload can take; run it as if a day had passed.
    const { deleted } = await sweepOrphanObjects(setup.ctx, { olderThanHours: 24, now: new Date(Date.now() + 25 * 3_600_000), prefix: `${t.company.id}/` });
    expect(deleted).toEqual([left[0].key]);
    expect(await stored()).toEqual([]);
  });

  it('takes the same photo again once the store is back', async () => {
    const res = await upload(20);
    expect(res.status).toBe(201);
    const rows = await setup.ctx.db.select().from(photos).where(eq(photos.applianceId, applianceId));
    expect(rows).toHaveLength(1);
    expect((await stored()).map((o) => o.key).sort()).toEqual([rows[0].displayKey, rows[0].thumbKey].sort());
  });
});

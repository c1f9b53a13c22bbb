import crypto from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tags } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import type { TagDto } from '../../shared/schemas/tags';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherAs: Awaited<ReturnType<typeof agentsFor>>;
let boilerId: string;
let bareId: string;
let firstCode: string;
let secondCode: string;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  [as, otherAs] = await Promise.all([agentsFor(app, t), agentsFor(app, other)]);
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
  boilerId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id })).id;
  bareId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'water_heater' })).id;
  const batch = await as.manager.post('/api/tag-batches').send({ count: 2, format: 'single_large' });
  [firstCode, secondCode] = batch.body.codes;
  expect((await as.technician.post('/api/tags/assign').send({ code: firstCode, applianceId: boilerId })).status).toBe(200);
  const replaced = await as.technician.post('/api/tags/assign').send({ code: secondCode, applianceId: boilerId, replaceDamaged: true });
  expect(replaced.status).toBe(200);
});
afterAll(() => ctx.pool.end());

describe('GET /api/appliances/:id/tags', () => {
  it('lists the attached tag first, then the retired one it replaced', async () => {
    const res = await as.technician.get(`/api/appliances/${boilerId}/tags`);
    expect(res.status).toBe(200);
    const body = res.body as TagDto[];
    expect(body.map((tag) => [tag.code, tag.status])).toEqual([
      [secondCode, 'assigned'],
      [firstCode, 'retired'],
    ]);
    const stored = await ctx.db.select().from(tags).where(eq(tags.applianceId, boilerId));
    expect(stored.map((row) => row.code).sort()).toEqual([firstCode, secondCode].sort());
    expect(body[1].retiredNote).toBe(stored.find((row) => row.code === firstCode)?.retiredNote);
    expect(body[1].replacedByTagId).toBe(body[0].id);
  });

  it('answers an empty list for an appliance without a tag', async () => {
    const res = await as.owner.get(`/api/appliances/${bareId}/tags`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual([]);
  });

  it('answers 400 for an id that is not a uuid', async () => {
    const res = await as.technician.get('/api/appliances/not-an-id/tags');
    expect(res.status).toBe(400);
    expect(res.body.error.details.id).toEqual(['Not a valid id.']);
  });

  it('answers 401 signed out and 403 to a homeowner', async () => {
    expect((await as.anonymous.get(`/api/appliances/${boilerId}/tags`)).status).toBe(401);
    expect((await as.homeowner.get(`/api/appliances/${boilerId}/tags`)).status).toBe(403);
  });

  it("answers 404 for another company's appliance and for an unknown one", async () => {
    const res = await otherAs.manager.get(`/api/appliances/${boilerId}/tags`);
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toContain(secondCode);
    expect((await as.manager.get(`/api/appliances/${crypto.randomUUID()}/tags`)).status).toBe(404);
  });
});

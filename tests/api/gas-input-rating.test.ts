import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { visits } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let visitId: string;
let revision = 0;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
  const boiler = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, fuel: 'natural_gas', inputBtuh: 100_000 });
  const started = await as.technician.post('/api/visits').send({ applianceId: boiler.id, type: 'annual_maintenance' }).expect(200);
  visitId = started.body.id;
  revision = started.body.revision;
});
afterAll(() => ctx.pool.end());

async function clock(secondsPerRevolution: number) {
  const res = await as.technician
    .put(`/api/visits/${visitId}/draft`)
    .send({ revision, readings: { gasInput: { dialCubicFeet: 1, secondsPerRevolution, heatingValueBtuPerCubicFoot: 1000 } } });
  expect(res.status).toBe(200);
  revision = res.body.revision;
  return res.body.results;
}

describe('clocked gas input against the nameplate rating', () => {
  it('flags over-firing, stored with the visit', async () => {
    // 1 ft³ in 30 s at 1,000 Btu/ft³ = 3600/30 × 1000 = 120,000 Btu/h: 20 % over a 100,000 Btu/h rating.
    // Source: the clocking formula ft³/h = 3600 × dial / seconds (trade training, secondary); NFPA 54 prohibits over-firing.
    const results = await clock(30);
    expect(results.gasInput.inputBtuPerHour).toBeCloseTo(120_000, 6);
    expect(results.gasInput.rating.status).toBe('over_fired');
    expect(results.flags.map((f: { code: string }) => f.code)).toContain('gas_input_over_fired');
    const [row] = await ctx.db.select().from(visits).where(eq(visits.id, visitId));
    expect((row.results as { gasInput: { rating: { status: string } } }).gasInput.rating.status).toBe('over_fired');
  });

  it('judges under-firing only once the company sets a tolerance', async () => {
    // 1 ft³ in 45 s at 1,000 Btu/ft³ = 80,000 Btu/h: 20 % under the rating.
    let results = await clock(45);
    expect(results.gasInput.rating.status).toBe('within_rating');
    expect(results.flags.map((f: { code: string }) => f.code)).not.toContain('gas_input_under_fired');

    await as.owner.patch('/api/company').send({ underFiringTolerancePct: 10 }).expect(200);
    results = await clock(45);
    expect(results.gasInput.rating.status).toBe('under_fired');
    const flag = results.flags.find((f: { code: string }) => f.code === 'gas_input_under_fired');
    expect(flag).toMatchObject({ severity: 'info', threshold: 90_000, source: 'company policy' });
  });

  it('refuses a tolerance outside 1–50 % with a field error', async () => {
    const res = await as.owner.patch('/api/company').send({ underFiringTolerancePct: 80 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details)).toEqual(['underFiringTolerancePct']);
  });
});

import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { visits } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { todayInTimeZone } from '../../shared/dates';
import { addMonths } from '../../shared/trade/iso-date';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';
import { runFileAt } from '../support/clock';

const { app, ctx } = testApp();
// A Wednesday noon in the company's zone: "today" and every date worked out from it stay put while the file runs.
runFileAt('2026-11-18T12:00:00-05:00');
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
const ids: Record<string, string> = {};

async function boiler(tenant: Tenant, name: string, opts: { annualMonthsAgo?: number[]; status?: 'in_service' | 'removed' } = {}) {
  const site = await insertSite(ctx.db, { companyId: tenant.company.id, customerId: tenant.customer.id, street: `${name} Street` });
  const a = await insertAppliance(ctx.db, { companyId: tenant.company.id, siteId: site.id, status: opts.status ?? 'in_service' });
  const today = todayInTimeZone(tenant.company.timeZone);
  for (const months of opts.annualMonthsAgo ?? []) {
    await ctx.db.insert(visits).values({ companyId: tenant.company.id, applianceId: a.id, type: 'annual_maintenance', status: 'completed', visitedOn: addMonths(today, -months) });
  }
  ids[name] = a.id;
}

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  await boiler(t, 'lapsed', { annualMonthsAgo: [36, 24] });
  await boiler(t, 'recent', { annualMonthsAgo: [27, 15, 3] });
  await boiler(t, 'never');
  await boiler(t, 'removed', { status: 'removed' });
  await boiler(other, 'elsewhere');
});
afterAll(() => ctx.pool.end());

describe('annual service due', () => {
  it('lists in-service appliances last serviced more than a year ago, never-serviced first, with the customer’s contact', async () => {
    const res = await as.manager.get('/api/fleet/annual-service-due');
    expect(res.status).toBe(200);
    expect(res.body.items.map((i: { applianceId: string }) => i.applianceId)).toEqual([ids.never, ids.lapsed]);
    expect(res.body.total).toBe(2);
    const lapsed = res.body.items[1];
    expect(lapsed.lastAnnualOn).toBe(addMonths(res.body.asOf, -24));
    expect(lapsed.customer).toMatchObject({ id: t.customer.id, name: t.customer.name, phone: t.customer.phone, remindersOptOut: false });
  });

  it('401 signed out, 403 for a homeowner, 400 for a bad limit', async () => {
    expect((await as.anonymous.get('/api/fleet/annual-service-due')).status).toBe(401);
    expect((await as.homeowner.get('/api/fleet/annual-service-due')).status).toBe(403);
    expect((await as.manager.get('/api/fleet/annual-service-due?limit=0')).status).toBe(400);
  });
});

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

type Overrides = Parameters<typeof insertAppliance>[1];
async function boiler(tenant: Tenant, name: string, yearsOld: number, fields: Partial<Overrides>) {
  const site = await insertSite(ctx.db, { companyId: tenant.company.id, customerId: tenant.customer.id });
  const today = todayInTimeZone(tenant.company.timeZone);
  const a = await insertAppliance(ctx.db, { companyId: tenant.company.id, siteId: site.id, installedOn: addMonths(today, -12 * yearsOld), ...fields });
  ids[name] = a.id;
  return a;
}

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  // Source: ASHRAE Handbook, HVAC Applications, owning-and-operating-costs chapter, service-life table (secondary copy):
  // steam boiler, cast iron 30 years; hot-water boiler, cast iron 35; steel fire-tube 25; condensing has no row.
  const old = await boiler(t, 'pastSteam', 31, { kind: 'steam_boiler', construction: 'cast_iron' });
  await ctx.db.insert(visits).values({
    companyId: t.company.id,
    applianceId: old.id,
    type: 'annual_maintenance',
    status: 'completed',
    visitedOn: '2026-10-01',
    results: { combustion: { efficiencyPct: 78.4, coAirFreePpm: 55 } },
  });
  await boiler(t, 'nearHotWater', 34, { kind: 'hot_water_boiler', construction: 'cast_iron' });
  await boiler(t, 'youngFireTube', 10, { kind: 'hot_water_boiler', construction: 'steel_fire_tube' });
  await boiler(t, 'condensing', 40, { kind: 'hot_water_boiler', construction: 'condensing' });
  await boiler(t, 'removed', 50, { kind: 'steam_boiler', construction: 'cast_iron', status: 'removed' });
  await boiler(other, 'elsewhere', 45, { kind: 'steam_boiler', construction: 'cast_iron' });
});
afterAll(() => ctx.pool.end());

describe('replacement prospects', () => {
  it('lists appliances near or past their median life, oldest first, with their last combustion results', async () => {
    const res = await as.manager.get('/api/fleet/replacement-prospects');
    expect(res.status).toBe(200);
    expect(res.body.map((p: { applianceId: string }) => p.applianceId)).toEqual([ids.nearHotWater, ids.pastSteam]);
    expect(res.body[0]).toMatchObject({ ageYears: 34, medianYears: 35, status: 'near', lastCombustion: null });
    expect(res.body[1]).toMatchObject({ ageYears: 31, medianYears: 30, status: 'past', lastCombustion: { on: '2026-10-01', efficiencyPct: 78.4, coAirFreePpm: 55 } });
  });

  it('narrows with a smaller window', async () => {
    const res = await as.manager.get('/api/fleet/replacement-prospects?nearYears=0');
    expect(res.body.map((p: { applianceId: string }) => p.applianceId)).toEqual([ids.pastSteam]);
  });

  it('401 signed out, 403 for a homeowner, 400 for a bad window', async () => {
    expect((await as.anonymous.get('/api/fleet/replacement-prospects')).status).toBe(401);
    expect((await as.homeowner.get('/api/fleet/replacement-prospects')).status).toBe(403);
    expect((await as.manager.get('/api/fleet/replacement-prospects?nearYears=-1')).status).toBe(400);
  });
});

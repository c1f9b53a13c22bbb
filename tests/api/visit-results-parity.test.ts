import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { visits } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { computeReadingResults, storedResults } from '../../shared/visits/visit-results';
import type { ReadingsInput } from '../../shared/schemas/visits';
import { resultFacts } from '../../src/features/visits/lib/result-facts';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let siteId: string;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  siteId = (await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id })).id;
});
afterAll(() => ctx.pool.end());

/** What the visit editor computes: the appliance and company as the phone loads them, then the shared rule. */
async function phoneResults(applianceId: string, readings: ReadingsInput) {
  const record = await as.technician.get(`/api/appliances/${applianceId}`).expect(200);
  const me = await as.technician.get('/api/me').expect(200);
  return computeReadingResults(readings, resultFacts(record.body.appliance, me.body.company.underFiringTolerancePct, record.body.site));
}

// Source: the clocking formula ft³/h = 3600 × dial / seconds (trade training, secondary): 1 ft³ in 30 s at 1,000 Btu/ft³ = 120,000 Btu/h.
const overFired = { dialCubicFeet: 1, secondsPerRevolution: 30, heatingValueBtuPerCubicFoot: 1000 };
// 1 ft³ in 45 s = 80,000 Btu/h, 20 % under the rating: flagged only past a company tolerance.
const underFired = { dialCubicFeet: 1, secondsPerRevolution: 45, heatingValueBtuPerCubicFoot: 1000 };

type Setup = { kind?: 'water_heater' | 'hot_water_boiler'; elevationFt?: number };
// Source: NFPA 54 (secondary copy, older edition): 4 % per 1,000 ft above 2,000 ft → 21.12 % at 5,280 ft; 1 ft³ in
// 36.923 s at 1,000 Btu/ft³ is 97,500 Btu/h, within a 100,000 Btu/h nameplate at sea level, over-fired at 5,280 ft.
const nearlyRated = { dialCubicFeet: 1, secondsPerRevolution: 3600 / 97.5, heatingValueBtuPerCubicFoot: 1000 };
// Source: ANSI Z21.10.1 (secondary): 200 ppm air-free for water heaters. 101 ppm at 10.45 % O2 is 202 ppm air-free.
const co202AirFree = { o2Pct: 10.45, coPpm: 101, flueTempF: 400, airTempF: 70 };

const cases: [string, ReadingsInput, number | null, string[], Setup?][] = [
  ['a nearly rated input at sea level', { gasInput: nearlyRated }, null, []],
  ['the same input at 5,280 ft, derated', { gasInput: nearlyRated }, null, ['gas_input_over_fired'], { elevationFt: 5280 }],
  ['202 ppm air-free CO on a water heater', { combustion: co202AirFree }, null, ['flue_co_service_required', 'air_free_co_above_certification_limit'], { kind: 'water_heater' }],
  ['202 ppm air-free CO on a boiler', { combustion: co202AirFree }, null, ['flue_co_service_required'], { kind: 'hot_water_boiler' }],
  ['a thermocouple to replace', { thermocouple: { openCircuitMv: 12 } }, null, ['thermocouple_replace']],
  ['a cutoff that tripped with the water out of sight', { lowWaterCutoff: { type: 'float', trippedWith: 'below_visible', burnerStopped: true } }, null, ['low_water_cutoff_tripped_too_low']],
  ['over-firing against the nameplate', { gasInput: overFired }, null, ['gas_input_over_fired']],
  ['under-firing with no company tolerance', { gasInput: underFired }, null, []],
  ['under-firing past a 10 % tolerance', { gasInput: underFired }, 10, ['gas_input_under_fired']],
  ['a low-water cutoff that did not stop the burner', { lowWaterCutoff: { type: 'float', burnerStopped: false } }, null, ['low_water_cutoff_failed']],
  [
    'combustion, gas rating, an empty gauge glass and a failed cutoff together',
    {
      combustion: { o2Pct: 6, coPpm: 50, flueTempF: 400, airTempF: 70 },
      gasInput: overFired,
      gaugeGlassLevel: 'empty',
      lowWaterCutoff: { type: 'probe', burnerStopped: false },
    },
    null,
    ['flue_co_service_recommended', 'gas_input_over_fired', 'no_water_visible', 'low_water_cutoff_failed'],
  ],
];

describe('the phone and the server compute the same visit results', () => {
  it.each(cases)('%s', async (_name, readings, tolerancePct, expectedCodes, setup = {}) => {
    const site = setup.elevationFt === undefined ? siteId : (await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id, elevationFt: setup.elevationFt })).id;
    const kind = setup.kind ?? 'steam_boiler';
    const { id: applianceId } = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site, kind, fuel: 'natural_gas', inputBtuh: 100_000 });
    await as.owner.patch('/api/company').send({ underFiringTolerancePct: tolerancePct }).expect(200);
    const started = await as.technician.post('/api/visits').send({ applianceId, type: 'annual_maintenance' }).expect(200);
    const saved = await as.technician.put(`/api/visits/${started.body.id}/draft`).send({ revision: started.body.revision, readings }).expect(200);

    const phone = await phoneResults(applianceId, readings);
    const [row] = await ctx.db.select().from(visits).where(eq(visits.id, started.body.id));
    expect(phone.flags.map((f) => f.code)).toEqual(expectedCodes);
    expect(row.results).toEqual(JSON.parse(JSON.stringify(storedResults(phone))));
    expect(saved.body.results).toEqual(row.results);
    expect(saved.body.outcomeRequired).toBe(phone.outcomeRequired);
  });
});

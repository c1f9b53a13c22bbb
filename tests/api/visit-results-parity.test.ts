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
  return computeReadingResults(readings, resultFacts(record.body.appliance, me.body.company.underFiringTolerancePct));
}

// Source: the clocking formula ft³/h = 3600 × dial / seconds (trade training, secondary): 1 ft³ in 30 s at 1,000 Btu/ft³ = 120,000 Btu/h.
const overFired = { dialCubicFeet: 1, secondsPerRevolution: 30, heatingValueBtuPerCubicFoot: 1000 };
// 1 ft³ in 45 s = 80,000 Btu/h, 20 % under the rating: flagged only past a company tolerance.
const underFired = { dialCubicFeet: 1, secondsPerRevolution: 45, heatingValueBtuPerCubicFoot: 1000 };

const cases: [string, ReadingsInput, number | null, string[]][] = [
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
  it.each(cases)('%s', async (_name, readings, tolerancePct, expectedCodes) => {
    const { id: applianceId } = await insertAppliance(ctx.db, { companyId: t.company.id, siteId, fuel: 'natural_gas', inputBtuh: 100_000 });
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

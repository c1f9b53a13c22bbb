import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { partSwaps } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import type { VisitDto } from '../../shared/schemas/visits';
import { testApp } from '../support/context';
import { useTenantFixture } from '../support/tenant-fixture';

const { app, ctx } = testApp();
const fx = useTenantFixture(app, ctx);

async function boilerWithVisit() {
  const site = await insertSite(ctx.db, { companyId: fx.t.company.id, customerId: fx.t.customer.id });
  const boiler = await insertAppliance(ctx.db, { companyId: fx.t.company.id, siteId: site.id, components: [{ typeCode: 'thermocouple', installedOn: '2018-01-01', spec: { lengthIn: 24 } }] });
  const visit = (await fx.as.technician.post('/api/visits').send({ applianceId: boiler.id, type: 'repair' })).body as VisitDto;
  return { partId: boiler.components[0].id, visitId: visit.id };
}

describe('the cause of a part swap', () => {
  it('stores the cause the form sends: an upgrade is kept apart from a worn-out part', async () => {
    const { partId, visitId } = await boilerWithVisit();
    const res = await fx.as.technician.post(`/api/visits/${visitId}/swaps`).send({ componentId: partId, cause: 'upgrade', reason: 'longer lead' });
    expect(res.status).toBe(200);
    const [row] = await ctx.db.select().from(partSwaps).where(eq(partSwaps.visitId, visitId));
    expect(row).toMatchObject({ cause: 'upgrade', reason: 'longer lead', removedComponentId: partId });
  });

  it('answers an unknown cause with a field-level 400 and stores nothing', async () => {
    const { partId, visitId } = await boilerWithVisit();
    const res = await fx.as.technician.post(`/api/visits/${visitId}/swaps`).send({ componentId: partId, cause: 'boredom' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.cause).toEqual(['Say why the old part came out.']);
    expect(await ctx.db.select().from(partSwaps).where(eq(partSwaps.visitId, visitId))).toHaveLength(0);
  });

  it('reads a swap sent without a cause (an older client) as worn out or failed, as old rows are', async () => {
    const { partId, visitId } = await boilerWithVisit();
    expect((await fx.as.technician.post(`/api/visits/${visitId}/swaps`).send({ componentId: partId })).status).toBe(200);
    const [row] = await ctx.db.select().from(partSwaps).where(eq(partSwaps.visitId, visitId));
    expect(row!.cause).toBe('wear_or_failure');
  });
});

import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { recomputeDueForAppliance } from '../../server/modules/due/due.repository';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
const TRICKY_NAME = 'Hale, "Bud" & Sons';
const FORMULA_NAME = '=HYPERLINK("http://example.test")';

async function boilerWithFailedThermocouple(tenant: Tenant, customerName: string) {
  const customer = await insertCustomer(ctx.db, { companyId: tenant.company.id, name: customerName });
  const site = await insertSite(ctx.db, { companyId: tenant.company.id, customerId: customer.id, street: '4 Comma Court, Rear', town: 'Wrenfield' });
  const boiler = await insertAppliance(ctx.db, {
    companyId: tenant.company.id,
    siteId: site.id,
    installedOn: '2010-05-01',
    components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 }, installedOn: '2020-01-01', conditionFailed: true }],
  });
  await recomputeDueForAppliance(ctx.db, tenant.company.id, boiler.id);
  return boiler;
}

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  await boilerWithFailedThermocouple(t, TRICKY_NAME);
  await boilerWithFailedThermocouple(t, FORMULA_NAME);
  await boilerWithFailedThermocouple(other, 'Another Company Customer');
});
afterAll(() => ctx.pool.end());

describe('due list as CSV', () => {
  it('quotes commas and quotes so a CSV parser reads the names back exactly, and keeps to the tenant', async () => {
    const res = await as.manager.get('/api/due/export.csv?withinDays=30');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toBe('attachment; filename="due-list-next-30-days.csv"');
    const parsed = Papa.parse<Record<string, string>>(res.text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const customers = parsed.data.map((r) => r.Customer).sort();
    // escapeFormulae prefixes a leading "=" with a quote so a spreadsheet shows it as text.
    expect(customers).toEqual([`'${FORMULA_NAME}`, TRICKY_NAME].sort());
    const row = parsed.data.find((r) => r.Customer === TRICKY_NAME)!;
    expect(row).toMatchObject({ Status: 'replace now', What: 'replace', Part: 'thermocouple', Specification: '24 in', Street: '4 Comma Court, Rear' });
    expect(res.text).toContain('"Hale, ""Bud"" & Sons"');
  });

  it('401 signed out, 403 for a homeowner, 400 for a bad window', async () => {
    expect((await as.anonymous.get('/api/due/export.csv')).status).toBe(401);
    expect((await as.homeowner.get('/api/due/export.csv')).status).toBe(403);
    const bad = await as.manager.get('/api/due/export.csv?withinDays=-4');
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details)).toEqual(['withinDays']);
  });
});

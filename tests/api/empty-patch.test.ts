import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, companies } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { routeTable } from '../../server/lib/route';
import { NOTHING_TO_CHANGE_MESSAGE } from '../../shared/schemas/common';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let paths: Record<string, string>;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
  const boiler = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id });
  // Validation runs before any lookup, so ids of records that do not exist (photo, request) are as good here.
  paths = {
    '/company': '/company',
    '/customers/:id': `/customers/${t.customer.id}`,
    '/sites/:id': `/sites/${site.id}`,
    '/appliances/:id': `/appliances/${boiler.id}`,
    '/catalog/component-types/:code': '/catalog/component-types/thermocouple',
    '/photos/:id': `/photos/${crypto.randomUUID()}`,
    '/members/:id': `/members/${t.technician.membership.id}`,
    '/service-requests/:id': `/service-requests/${crypto.randomUUID()}`,
  };
});
afterAll(() => ctx.pool.end());

/** PATCH routes whose every field is optional: an empty patch is refused at the form level. */
const OPTIONAL_FIELDS = ['/company', '/customers/:id', '/sites/:id', '/appliances/:id', '/catalog/component-types/:code', '/photos/:id'];
/** PATCH routes with one required field: an empty patch names it. */
const REQUIRED_FIELD: Record<string, string> = { '/members/:id': 'role', '/service-requests/:id': 'status' };

const auditRows = async () => (await ctx.db.select().from(auditLog).where(eq(auditLog.companyId, t.company.id))).length;

describe('an empty PATCH', () => {
  it('is covered here for every PATCH route there is', () => {
    const patchRoutes = [...routeTable.values()].filter((r) => r.method === 'patch').map((r) => r.path);
    expect(patchRoutes.sort()).toEqual([...OPTIONAL_FIELDS, ...Object.keys(REQUIRED_FIELD)].sort());
  });

  it.each(OPTIONAL_FIELDS)('PATCH %s with {} or only unknown fields is a form-level 400 and writes nothing', async (route) => {
    const before = await auditRows();
    for (const body of [{}, { noSuchField: 'x' }]) {
      const res = await as.owner.patch(`/api${paths[route]}`).send(body);
      expect({ route, body, status: res.status, details: res.body.error?.details }).toEqual({
        route,
        body,
        status: 400,
        details: { _: [NOTHING_TO_CHANGE_MESSAGE] },
      });
    }
    expect(await auditRows()).toBe(before);
  });

  it.each(Object.entries(REQUIRED_FIELD))('PATCH %s with {} names its required field %s', async (route, field) => {
    const res = await as.owner.patch(`/api${paths[route]}`).send({});
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details)).toEqual([field]);
  });

  it('leaves the company as it was, and a patch naming a field still saves it', async () => {
    const [before] = await ctx.db.select().from(companies).where(eq(companies.id, t.company.id));
    expect((await as.owner.patch('/api/company').send({})).status).toBe(400);
    expect((await ctx.db.select().from(companies).where(eq(companies.id, t.company.id)))[0]).toEqual(before);
    const res = await as.owner.patch('/api/company').send({ phone: '555-0199' });
    expect(res.status).toBe(200);
    expect(res.body.phone).toBe('555-0199');
  });
});

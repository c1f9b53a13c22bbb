import type { Express } from 'express';
import { afterAll, beforeAll } from 'vitest';
import type { AppContext } from '../../server/context';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { agentsFor, createTenant, type Tenant } from './tenant';

export type TenantFixture = { t: Tenant; as: Awaited<ReturnType<typeof agentsFor>> };
export type TenantWithBoiler = TenantFixture & { boilerId: string };

/** For one test file: a fresh tenant and its signed-in agents; the pool closed after. */
export function useTenantFixture(app: Express, ctx: AppContext): TenantFixture {
  const fixture = {} as TenantFixture;
  beforeAll(async () => {
    fixture.t = await createTenant(ctx.db);
    fixture.as = await agentsFor(app, fixture.t);
  });
  afterAll(() => ctx.pool.end());
  return fixture;
}

/** The same, with one boiler at a site of its customer. */
export function useTenantWithBoiler(app: Express, ctx: AppContext): TenantWithBoiler {
  const fixture = useTenantFixture(app, ctx) as TenantWithBoiler;
  beforeAll(async () => {
    const site = await insertSite(ctx.db, { companyId: fixture.t.company.id, customerId: fixture.t.customer.id });
    fixture.boilerId = (await insertAppliance(ctx.db, { companyId: fixture.t.company.id, siteId: site.id })).id;
  });
  return fixture;
}

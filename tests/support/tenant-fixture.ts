import type { Express } from 'express';
import { afterAll, beforeAll } from 'vitest';
import type { AppContext } from '../../server/context';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { agentsFor, createTenant, type Tenant } from './tenant';

export type TenantWithBoiler = { t: Tenant; as: Awaited<ReturnType<typeof agentsFor>>; boilerId: string };

/** For one test file: a fresh tenant, its signed-in agents and one boiler at a site of its customer; the pool closed after. */
export function useTenantWithBoiler(app: Express, ctx: AppContext): TenantWithBoiler {
  const fixture = {} as TenantWithBoiler;
  beforeAll(async () => {
    fixture.t = await createTenant(ctx.db);
    fixture.as = await agentsFor(app, fixture.t);
    const site = await insertSite(ctx.db, { companyId: fixture.t.company.id, customerId: fixture.t.customer.id });
    fixture.boilerId = (await insertAppliance(ctx.db, { companyId: fixture.t.company.id, siteId: site.id })).id;
  });
  afterAll(() => ctx.pool.end());
  return fixture;
}

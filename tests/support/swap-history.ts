import { eq } from 'drizzle-orm';
import type { DbOrTx } from '../../server/db/client';
import { components, partSwaps, visits } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import type { SwapCause } from '../../shared/stats/swap-causes';
import type { Tenant } from './tenant';

/**
 * One appliance whose part of `typeCode` was installed on `installedOn` and swapped on `swappedOn` for `cause`;
 * with `boilerGoneOn`, the fresh part left with its whole boiler that day.
 */
export async function swappedPart(
  db: DbOrTx,
  t: Tenant,
  typeCode: 'thermocouple' | 'flame_sensor',
  installedOn: string,
  swappedOn: string,
  cause: SwapCause,
  boilerGoneOn?: string,
) {
  const site = await insertSite(db, { companyId: t.company.id, customerId: t.customer.id });
  const spec: Record<string, number> = typeCode === 'thermocouple' ? { lengthIn: 24 } : {};
  const a = await insertAppliance(db, { companyId: t.company.id, siteId: site.id, installedOn, components: [{ typeCode, installedOn, spec }] });
  const old = a.components[0];
  const [visit] = await db.insert(visits).values({ companyId: t.company.id, applianceId: a.id, type: 'repair', status: 'completed', visitedOn: swappedOn }).returning();
  const gone = boilerGoneOn ? { removedOn: boilerGoneOn, removalReason: 'Removed with the appliance' } : {};
  const [fresh] = await db
    .insert(components)
    .values({ companyId: t.company.id, applianceId: a.id, typeCode, installedOn: swappedOn, spec: old.spec, specKey: old.specKey, ...gone })
    .returning();
  await db.update(components).set({ removedOn: swappedOn, replacedById: fresh.id }).where(eq(components.id, old.id));
  await db.insert(partSwaps).values({ companyId: t.company.id, visitId: visit.id, applianceId: a.id, removedComponentId: old.id, newComponentId: fresh.id, swappedOn, cause });
}

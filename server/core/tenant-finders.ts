import { and, eq, isNull } from 'drizzle-orm';
import type { DbOrTx } from '../db/client';
import { appliances, companies, customers, memberships, sites } from '../db/schema/index';

/**
 * Tenant-scoped look-ups many modules need, one of each. Every finder but findCompany takes the caller's companyId,
 * so another company's id finds nothing and the route answers 404.
 */

export type CompanyRow = typeof companies.$inferSelect;
export type CustomerRow = typeof customers.$inferSelect;
export type SiteRow = typeof sites.$inferSelect;
export type ApplianceRow = typeof appliances.$inferSelect;

export async function findCompany(db: DbOrTx, companyId: string): Promise<CompanyRow | null> {
  const [row] = await db.select().from(companies).where(eq(companies.id, companyId)).limit(1);
  return row ?? null;
}

/** What a homeowner or a link holder may read about the company: its name and phone. */
export async function findCompanyContact(db: DbOrTx, companyId: string): Promise<{ name: string; phone: string }> {
  const [row] = await db.select({ name: companies.name, phone: companies.phone }).from(companies).where(eq(companies.id, companyId));
  return row;
}

/** The appliance with its site's customer; `forUpdate` locks the appliance row for the rest of the transaction. */
export async function findAppliance(
  db: DbOrTx,
  companyId: string,
  applianceId: string,
  options: { forUpdate?: boolean } = {},
): Promise<(ApplianceRow & { customerId: string }) | null> {
  const query = db
    .select({ appliance: appliances, customerId: sites.customerId })
    .from(appliances)
    .innerJoin(sites, eq(sites.id, appliances.siteId))
    .where(and(eq(appliances.companyId, companyId), eq(appliances.id, applianceId)))
    .limit(1);
  const [row] = options.forUpdate ? await query.for('update', { of: appliances }) : await query;
  return row ? { ...row.appliance, customerId: row.customerId } : null;
}

export async function findSite(db: DbOrTx, companyId: string, siteId: string): Promise<SiteRow | null> {
  const [row] = await db.select().from(sites).where(and(eq(sites.companyId, companyId), eq(sites.id, siteId))).limit(1);
  return row ?? null;
}

export async function findCustomer(db: DbOrTx, companyId: string, customerId: string): Promise<CustomerRow | null> {
  const [row] = await db.select().from(customers).where(and(eq(customers.companyId, companyId), eq(customers.id, customerId))).limit(1);
  return row ?? null;
}

/** An active (not deactivated) member of the company. */
export async function findActiveMember(db: DbOrTx, companyId: string, userId: string): Promise<{ userId: string } | null> {
  const [row] = await db
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.companyId, companyId), eq(memberships.userId, userId), isNull(memberships.deactivatedAt)))
    .limit(1);
  return row ?? null;
}

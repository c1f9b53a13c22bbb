import { and, asc, eq, inArray } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { sites, users } from '../../db/schema/index';
import type { SiteDto } from '../../../shared/schemas/records';

type NewSite = Omit<typeof sites.$inferInsert, 'id'>;

const siteColumns = {
  id: sites.id,
  customerId: sites.customerId,
  street: sites.street,
  town: sites.town,
  postalCode: sites.postalCode,
  accessNotes: sites.accessNotes,
  elevationFt: sites.elevationFt,
  assignedTechnicianId: sites.assignedTechnicianId,
  assignedTechnicianName: users.name,
};

export const sitesRepository = {
  async insert(db: DbOrTx, values: NewSite) {
    const [row] = await db.insert(sites).values(values).returning({ id: sites.id });
    return row;
  },
  async update(db: DbOrTx, companyId: string, id: string, values: Partial<NewSite>) {
    const [row] = await db
      .update(sites)
      .set(values)
      .where(and(eq(sites.companyId, companyId), eq(sites.id, id)))
      .returning({ id: sites.id });
    return row ?? null;
  },
  async find(db: DbOrTx, companyId: string, id: string): Promise<SiteDto | null> {
    const [row] = await db
      .select(siteColumns)
      .from(sites)
      .leftJoin(users, eq(users.id, sites.assignedTechnicianId))
      .where(and(eq(sites.companyId, companyId), eq(sites.id, id)))
      .limit(1);
    return row ?? null;
  },
  listForCustomers(db: DbOrTx, companyId: string, customerIds: string[]): Promise<SiteDto[]> {
    if (!customerIds.length) return Promise.resolve([]);
    return db
      .select(siteColumns)
      .from(sites)
      .leftJoin(users, eq(users.id, sites.assignedTechnicianId))
      .where(and(eq(sites.companyId, companyId), inArray(sites.customerId, customerIds)))
      .orderBy(asc(sites.street), asc(sites.id));
  },
  /** An active member of the company (anyone who can be sent out), or null. */
};

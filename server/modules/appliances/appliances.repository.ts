import { and, asc, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { appliances, componentCatalog, components, visits } from '../../db/schema/index';
import type { ApplianceSummary } from '../../../shared/schemas/records';

export type ApplianceRow = typeof appliances.$inferSelect;
export type ComponentRow = typeof components.$inferSelect;
type NewAppliance = Omit<typeof appliances.$inferInsert, 'id'>;
export type NewComponent = Omit<typeof components.$inferInsert, 'id'>;

const summaryColumns = {
  id: appliances.id,
  siteId: appliances.siteId,
  kind: appliances.kind,
  fuel: appliances.fuel,
  construction: appliances.construction,
  manufacturer: appliances.manufacturer,
  model: appliances.model,
  serial: appliances.serial,
  status: appliances.status,
  installedOn: appliances.installedOn,
  location: appliances.location,
};

export const appliancesRepository = {
  async insert(db: DbOrTx, values: NewAppliance) {
    const [row] = await db.insert(appliances).values(values).returning();
    return row;
  },
  async update(db: DbOrTx, companyId: string, id: string, values: Partial<NewAppliance>) {
    const [row] = await db
      .update(appliances)
      .set(values)
      .where(and(eq(appliances.companyId, companyId), eq(appliances.id, id)))
      .returning();
    return row ?? null;
  },
  async find(db: DbOrTx, companyId: string, id: string, options: { forUpdate?: boolean } = {}) {
    const query = db
      .select()
      .from(appliances)
      .where(and(eq(appliances.companyId, companyId), eq(appliances.id, id)))
      .limit(1);
    const [row] = options.forUpdate ? await query.for('update') : await query;
    return row ?? null;
  },
  /** The appliance this one replaced, if any. */
  async findReplaced(db: DbOrTx, companyId: string, id: string) {
    const [row] = await db
      .select()
      .from(appliances)
      .where(and(eq(appliances.companyId, companyId), eq(appliances.replacedById, id)))
      .orderBy(desc(appliances.updatedAt))
      .limit(1);
    return row ?? null;
  },
  /** Removed appliances come last on a customer's page. */
  summariesForSites(db: DbOrTx, companyId: string, siteIds: string[]): Promise<ApplianceSummary[]> {
    if (!siteIds.length) return Promise.resolve([]);
    return db
      .select(summaryColumns)
      .from(appliances)
      .where(and(eq(appliances.companyId, companyId), inArray(appliances.siteId, siteIds)))
      .orderBy(sql`${appliances.status} = 'removed'`, asc(appliances.installedOn), asc(appliances.id));
  },
  async insertComponents(db: DbOrTx, rows: NewComponent[]) {
    if (!rows.length) return [];
    return db.insert(components).values(rows).returning();
  },
  /** Present parts first, removed parts after them (most recently removed first). */
  components(db: DbOrTx, companyId: string, applianceId: string) {
    return db
      .select({ component: components, catalogLabel: componentCatalog.label })
      .from(components)
      .leftJoin(componentCatalog, and(eq(componentCatalog.companyId, components.companyId), eq(componentCatalog.code, components.typeCode)))
      .where(and(eq(components.companyId, companyId), eq(components.applianceId, applianceId)))
      .orderBy(sql`${components.removedOn} is not null`, desc(components.removedOn), asc(componentCatalog.group), asc(components.typeCode), asc(components.createdAt));
  },
  /** Retire the parts of a removed appliance, so they leave due lists and stock counts with it. */
  async removeComponentsOf(db: DbOrTx, companyId: string, applianceId: string, removedOn: string, reason: string, actorId: string) {
    await db
      .update(components)
      .set({ removedOn, removalReason: reason, updatedBy: actorId })
      .where(and(eq(components.companyId, companyId), eq(components.applianceId, applianceId), isNull(components.removedOn)));
  },
  async latestVisit(db: DbOrTx, companyId: string, applianceId: string, status: 'draft' | 'completed') {
    const [row] = await db
      .select({ id: visits.id, visitedOn: visits.visitedOn, type: visits.type, outcome: visits.outcome, outcomeReason: visits.outcomeReason })
      .from(visits)
      .where(and(eq(visits.companyId, companyId), eq(visits.applianceId, applianceId), eq(visits.status, status)))
      .orderBy(desc(visits.visitedOn), sql`${visits.completedAt} desc nulls last`, desc(visits.createdAt))
      .limit(1);
    return row ?? null;
  },
};

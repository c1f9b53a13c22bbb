import { and, asc, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import {
  appliances,
  componentCatalog,
  components,
  memberships,
  partSwaps,
  sites,
  users,
  companies,
  visitAmendments,
  visits,
} from '../../db/schema/index';

export type VisitRow = typeof visits.$inferSelect;
export type ComponentRow = typeof components.$inferSelect;

export const visitsRepository = {
  async applianceReadingFacts(db: DbOrTx, companyId: string, id: string) {
    const [row] = await db
      .select({
        id: appliances.id,
        kind: appliances.kind,
        fuel: appliances.fuel,
        ventType: appliances.ventType,
        construction: appliances.construction,
        inputBtuh: appliances.inputBtuh,
        underFiringTolerancePct: companies.underFiringTolerancePct,
        elevationFt: sites.elevationFt,
      })
      .from(appliances)
      .innerJoin(companies, eq(companies.id, appliances.companyId))
      .innerJoin(sites, eq(sites.id, appliances.siteId))
      .where(and(eq(appliances.companyId, companyId), eq(appliances.id, id)))
      .limit(1);
    return row ?? null;
  },

  /** Serialises "start a visit" per appliance and technician, so a retried tap finds the first draft. */
  async lockStart(db: DbOrTx, applianceId: string, userId: string) {
    await db.execute(sql`select pg_advisory_xact_lock(hashtext(${`visit-start:${applianceId}:${userId}`}))`);
  },

  /** Serialises starts that name the same visit id, whichever company or appliance they are for. */
  async lockVisitId(db: DbOrTx, visitId: string) {
    await db.execute(sql`select pg_advisory_xact_lock(hashtext(${`visit-id:${visitId}`}))`);
  },

  /** Across companies, on purpose: an id is unique in the whole table. The caller must not show another company's row. */
  async findVisitOwner(db: DbOrTx, id: string) {
    const [row] = await db
      .select({ companyId: visits.companyId, applianceId: visits.applianceId, technicianIds: visits.technicianIds })
      .from(visits)
      .where(eq(visits.id, id))
      .limit(1);
    return row;
  },

  async findOpenDraft(db: DbOrTx, companyId: string, applianceId: string, userId: string) {
    const [row] = await db
      .select()
      .from(visits)
      .where(
        and(
          eq(visits.companyId, companyId),
          eq(visits.applianceId, applianceId),
          eq(visits.status, 'draft'),
          sql`${visits.technicianIds} @> array[${userId}]::uuid[]`,
        ),
      )
      .orderBy(desc(visits.createdAt))
      .limit(1);
    return row ?? null;
  },

  async insertVisit(db: DbOrTx, values: typeof visits.$inferInsert) {
    const [row] = await db.insert(visits).values(values).returning();
    return row;
  },

  async findVisit(db: DbOrTx, companyId: string, id: string, options: { forUpdate?: boolean } = {}) {
    const query = db
      .select()
      .from(visits)
      .where(and(eq(visits.companyId, companyId), eq(visits.id, id)))
      .limit(1);
    const [row] = options.forUpdate ? await query.for('update') : await query;
    return row ?? null;
  },

  async updateVisit(db: DbOrTx, companyId: string, id: string, patch: Partial<typeof visits.$inferInsert>) {
    const [row] = await db
      .update(visits)
      .set(patch)
      .where(and(eq(visits.companyId, companyId), eq(visits.id, id)))
      .returning();
    return row;
  },

  /** Which of `userIds` are active members of the company. */
  async activeMemberIds(db: DbOrTx, companyId: string, userIds: string[]) {
    if (userIds.length === 0) return new Set<string>();
    const rows = await db
      .select({ userId: memberships.userId })
      .from(memberships)
      .where(and(eq(memberships.companyId, companyId), inArray(memberships.userId, userIds), isNull(memberships.deactivatedAt)));
    return new Set(rows.map((r) => r.userId));
  },

  async userNames(db: DbOrTx, userIds: string[]) {
    if (userIds.length === 0) return new Map<string, string>();
    const rows = await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, userIds));
    return new Map(rows.map((r) => [r.id, r.name]));
  },

  swapsOfVisit(db: DbOrTx, companyId: string, visitId: string) {
    return db
      .select({
        id: partSwaps.id,
        removedComponentId: partSwaps.removedComponentId,
        newComponentId: partSwaps.newComponentId,
        swappedOn: partSwaps.swappedOn,
        reason: partSwaps.reason,
        typeCode: components.typeCode,
        newDescription: components.description,
        newSpecKey: components.specKey,
        catalogLabel: componentCatalog.label,
      })
      .from(partSwaps)
      .innerJoin(components, eq(components.id, partSwaps.newComponentId))
      .leftJoin(componentCatalog, and(eq(componentCatalog.companyId, partSwaps.companyId), eq(componentCatalog.code, components.typeCode)))
      .where(and(eq(partSwaps.companyId, companyId), eq(partSwaps.visitId, visitId)))
      .orderBy(asc(partSwaps.createdAt), asc(partSwaps.id));
  },

  amendmentsOfVisit(db: DbOrTx, companyId: string, visitId: string) {
    return db
      .select({
        id: visitAmendments.id,
        reason: visitAmendments.reason,
        changes: visitAmendments.changes,
        createdAt: visitAmendments.createdAt,
        createdByName: users.name,
      })
      .from(visitAmendments)
      .leftJoin(users, eq(users.id, visitAmendments.createdBy))
      .where(and(eq(visitAmendments.companyId, companyId), eq(visitAmendments.visitId, visitId)))
      .orderBy(asc(visitAmendments.createdAt), asc(visitAmendments.id));
  },

  async insertAmendment(db: DbOrTx, values: typeof visitAmendments.$inferInsert) {
    const [row] = await db.insert(visitAmendments).values(values).returning();
    return row;
  },

  presentComponents(db: DbOrTx, companyId: string, applianceId: string) {
    return db
      .select()
      .from(components)
      .where(and(eq(components.companyId, companyId), eq(components.applianceId, applianceId), isNull(components.removedOn)));
  },

  async findComponent(db: DbOrTx, companyId: string, id: string, options: { forUpdate?: boolean } = {}) {
    const query = db
      .select()
      .from(components)
      .where(and(eq(components.companyId, companyId), eq(components.id, id)))
      .limit(1);
    const [row] = options.forUpdate ? await query.for('update') : await query;
    return row ?? null;
  },

  async updateComponent(db: DbOrTx, companyId: string, id: string, patch: Partial<typeof components.$inferInsert>) {
    await db
      .update(components)
      .set(patch)
      .where(and(eq(components.companyId, companyId), eq(components.id, id)));
  },

  async insertComponent(db: DbOrTx, values: typeof components.$inferInsert) {
    const [row] = await db.insert(components).values(values).returning();
    return row;
  },

  async insertSwap(db: DbOrTx, values: typeof partSwaps.$inferInsert) {
    const [row] = await db.insert(partSwaps).values(values).returning();
    return row;
  },

  async findSwapsOfVisit(db: DbOrTx, companyId: string, visitId: string, swapIds: string[]) {
    if (swapIds.length === 0) return [];
    return db
      .select()
      .from(partSwaps)
      .where(and(eq(partSwaps.companyId, companyId), eq(partSwaps.visitId, visitId), inArray(partSwaps.id, swapIds)));
  },

  async updateSwap(db: DbOrTx, companyId: string, id: string, patch: Partial<typeof partSwaps.$inferInsert>) {
    await db
      .update(partSwaps)
      .set(patch)
      .where(and(eq(partSwaps.companyId, companyId), eq(partSwaps.id, id)));
  },
};

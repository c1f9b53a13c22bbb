import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { appliances, companies, sites, tagBatches, tags, users } from '../../db/schema/index';
import type { TagFormatId } from '../../../shared/schemas/tags';

export type TagRow = typeof tags.$inferSelect;

export const tagsRepository = {
  async insertBatch(db: DbOrTx, values: { companyId: string; format: TagFormatId; count: number; createdBy: string }) {
    const [row] = await db.insert(tagBatches).values(values).returning();
    return row;
  },
  /** Inserts the codes that are still free; returns the ones that went in (a taken code is simply skipped). */
  async insertCodes(db: DbOrTx, rows: { companyId: string; batchId: string; code: string }[]) {
    if (!rows.length) return [];
    const inserted = await db.insert(tags).values(rows).onConflictDoNothing({ target: tags.code }).returning({ code: tags.code });
    return inserted.map((r) => r.code);
  },
  listBatches(db: DbOrTx, companyId: string) {
    return db
      .select({
        id: tagBatches.id,
        format: tagBatches.format,
        count: tagBatches.count,
        createdAt: tagBatches.createdAt,
        createdByName: users.name,
        assignedCount: sql<number>`(select count(*)::int from ${tags} where ${tags.batchId} = ${tagBatches.id} and ${tags.status} <> 'unassigned')`,
      })
      .from(tagBatches)
      .leftJoin(users, eq(users.id, tagBatches.createdBy))
      .where(eq(tagBatches.companyId, companyId))
      .orderBy(desc(tagBatches.createdAt), desc(tagBatches.id));
  },
  async findBatch(db: DbOrTx, companyId: string, batchId: string) {
    const [row] = await db
      .select()
      .from(tagBatches)
      .where(and(eq(tagBatches.companyId, companyId), eq(tagBatches.id, batchId)))
      .limit(1);
    return row ?? null;
  },
  async batchCodes(db: DbOrTx, batchId: string) {
    // Creation order keeps a reprinted sheet in the same order as the first print.
    const rows = await db.select({ code: tags.code }).from(tags).where(eq(tags.batchId, batchId)).orderBy(tags.createdAt, tags.code);
    return rows.map((r) => r.code);
  },
  /** Any company's tag, by code: for resolving a scan, whose answer then depends on who asks. */
  async findByCode(db: DbOrTx, code: string, options: { forUpdate?: boolean } = {}) {
    const query = db.select().from(tags).where(eq(tags.code, code)).limit(1);
    const [row] = options.forUpdate ? await query.for('update') : await query;
    return row ?? null;
  },
  async activeTagOf(db: DbOrTx, companyId: string, applianceId: string) {
    const [row] = await db
      .select()
      .from(tags)
      .where(and(eq(tags.companyId, companyId), eq(tags.applianceId, applianceId), eq(tags.status, 'assigned')))
      .for('update')
      .limit(1);
    return row ?? null;
  },
  /** The appliance's tags, the attached one first, then retired ones newest first. */
  tagsOf(db: DbOrTx, companyId: string, applianceId: string) {
    return db
      .select()
      .from(tags)
      .where(and(eq(tags.companyId, companyId), eq(tags.applianceId, applianceId)))
      .orderBy(sql`${tags.status} = 'assigned' desc`, desc(tags.assignedAt), desc(tags.id));
  },
  async update(db: DbOrTx, id: string, values: Partial<typeof tags.$inferInsert>) {
    const [row] = await db.update(tags).set(values).where(eq(tags.id, id)).returning();
    return row;
  },
  async applianceOwnedBy(db: DbOrTx, companyId: string, applianceId: string, customerIds: string[]) {
    if (!customerIds.length) return false;
    const [row] = await db
      .select({ id: appliances.id })
      .from(appliances)
      .innerJoin(sites, eq(sites.id, appliances.siteId))
      .where(and(eq(appliances.companyId, companyId), eq(appliances.id, applianceId), inArray(sites.customerId, customerIds)))
      .limit(1);
    return Boolean(row);
  },
  async company(db: DbOrTx, companyId: string) {
    const [row] = await db.select({ name: companies.name, phone: companies.phone }).from(companies).where(eq(companies.id, companyId)).limit(1);
    return row ?? null;
  },
};

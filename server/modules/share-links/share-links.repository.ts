import { and, desc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { appliances, shareLinks } from '../../db/schema/index';

export const shareLinksRepository = {
  async applianceExists(db: DbOrTx, companyId: string, applianceId: string) {
    const [row] = await db.select({ id: appliances.id }).from(appliances).where(and(eq(appliances.companyId, companyId), eq(appliances.id, applianceId)));
    return Boolean(row);
  },
  async insert(db: DbOrTx, row: typeof shareLinks.$inferInsert) {
    const [created] = await db.insert(shareLinks).values(row).returning();
    return created;
  },
  list(db: DbOrTx, companyId: string, applianceId: string) {
    return db
      .select()
      .from(shareLinks)
      .where(and(eq(shareLinks.companyId, companyId), eq(shareLinks.applianceId, applianceId)))
      .orderBy(desc(shareLinks.createdAt));
  },
  async find(db: DbOrTx, companyId: string, id: string) {
    const [row] = await db.select().from(shareLinks).where(and(eq(shareLinks.companyId, companyId), eq(shareLinks.id, id)));
    return row ?? null;
  },
  async findByHash(db: DbOrTx, tokenHash: string) {
    const [row] = await db.select().from(shareLinks).where(eq(shareLinks.tokenHash, tokenHash));
    return row ?? null;
  },
  async revoke(db: DbOrTx, companyId: string, id: string, actorId: string) {
    const [row] = await db
      .update(shareLinks)
      .set({ revokedAt: new Date(), revokedBy: actorId })
      .where(and(eq(shareLinks.companyId, companyId), eq(shareLinks.id, id)))
      .returning();
    return row ?? null;
  },
};

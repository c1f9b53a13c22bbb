import { and, desc, eq, isNull } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { appliances, companies, recordTransfers } from '../../db/schema/index';

export type TransferRow = typeof recordTransfers.$inferSelect;

export const recordTransfersRepository = {
  async applianceExists(db: DbOrTx, companyId: string, applianceId: string) {
    const [row] = await db.select({ id: appliances.id }).from(appliances).where(and(eq(appliances.companyId, companyId), eq(appliances.id, applianceId)));
    return Boolean(row);
  },
  async insert(db: DbOrTx, values: typeof recordTransfers.$inferInsert) {
    const [row] = await db.insert(recordTransfers).values(values).returning();
    return row!;
  },
  async find(db: DbOrTx, companyId: string, id: string) {
    const [row] = await db.select().from(recordTransfers).where(and(eq(recordTransfers.companyId, companyId), eq(recordTransfers.id, id)));
    return row ?? null;
  },
  list(db: DbOrTx, companyId: string, applianceId: string) {
    return db
      .select()
      .from(recordTransfers)
      .where(and(eq(recordTransfers.companyId, companyId), eq(recordTransfers.applianceId, applianceId)))
      .orderBy(desc(recordTransfers.createdAt));
  },
  async withdraw(db: DbOrTx, companyId: string, id: string, at: Date) {
    const [row] = await db
      .update(recordTransfers)
      .set({ withdrawnAt: at })
      .where(and(eq(recordTransfers.companyId, companyId), eq(recordTransfers.id, id), isNull(recordTransfers.withdrawnAt), isNull(recordTransfers.redeemedAt)))
      .returning();
    return row ?? null;
  },
  /** By code, across companies (the code is the key), with the sending company's name; `lock` holds the row to the end of the transaction. */
  async findByHash(db: DbOrTx, codeHash: string, lock = false) {
    const query = db.select().from(recordTransfers).where(eq(recordTransfers.codeHash, codeHash));
    const [row] = lock ? await query.for('update') : await query;
    return row ?? null;
  },
  async companyName(db: DbOrTx, companyId: string) {
    const [row] = await db.select({ name: companies.name }).from(companies).where(eq(companies.id, companyId));
    return row?.name ?? '';
  },
  async markRedeemed(db: DbOrTx, id: string, values: { redeemedAt: Date; redeemedByCompanyId: string; senderName: string }) {
    // Conditional as well as locked: a second redemption can never pass, whatever the isolation level.
    const [row] = await db
      .update(recordTransfers)
      .set(values)
      .where(and(eq(recordTransfers.id, id), isNull(recordTransfers.redeemedAt), isNull(recordTransfers.withdrawnAt)))
      .returning();
    return row ?? null;
  },
};

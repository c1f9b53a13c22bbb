import { and, asc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { makeupWaterEntries } from '../../db/schema/index';

export const makeupWaterRepository = {
  list(db: DbOrTx, companyId: string, applianceId: string) {
    return db
      .select({ id: makeupWaterEntries.id, recordedOn: makeupWaterEntries.recordedOn, kind: makeupWaterEntries.kind, gallons: makeupWaterEntries.gallons, note: makeupWaterEntries.note })
      .from(makeupWaterEntries)
      .where(and(eq(makeupWaterEntries.companyId, companyId), eq(makeupWaterEntries.applianceId, applianceId)))
      .orderBy(asc(makeupWaterEntries.recordedOn), asc(makeupWaterEntries.createdAt));
  },
  async insert(db: DbOrTx, row: typeof makeupWaterEntries.$inferInsert) {
    const [created] = await db.insert(makeupWaterEntries).values(row).returning();
    return created;
  },
};

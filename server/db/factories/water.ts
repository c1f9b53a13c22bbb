import type { DbOrTx } from '../client';
import { makeupWaterEntries } from '../schema/index';

export type MakeupWaterLogEntry = Pick<typeof makeupWaterEntries.$inferInsert, 'recordedOn' | 'kind' | 'gallons' | 'note'>;

/** A makeup-water log for one appliance in one insert (entries as given: the caller keeps a meter from running backwards). */
export async function insertMakeupWaterLog(db: DbOrTx, input: { companyId: string; applianceId: string; entries: MakeupWaterLogEntry[]; createdBy?: string | null }) {
  if (!input.entries.length) return [];
  return db
    .insert(makeupWaterEntries)
    .values(input.entries.map((e) => ({ ...e, companyId: input.companyId, applianceId: input.applianceId, createdBy: input.createdBy ?? null })))
    .returning();
}

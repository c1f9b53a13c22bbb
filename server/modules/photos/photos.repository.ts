import { and, desc, eq, inArray, isNull, or } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { appliances, components, photos, sites, timelineEvents, users, visits } from '../../db/schema/index';

export type PhotoRow = typeof photos.$inferSelect;
export type PhotoRowWithAuthor = PhotoRow & { createdByName: string | null };
type RecordSlot = { applianceId: string; visitId: string | null; componentId: string | null };

const withAuthor = { photo: photos, createdByName: users.name };
const flatten = (r: { photo: PhotoRow; createdByName: string | null }): PhotoRowWithAuthor => ({ ...r.photo, createdByName: r.createdByName });

export const photosRepository = {
  async findVisit(db: DbOrTx, companyId: string, visitId: string) {
    const [row] = await db
      .select({ id: visits.id, applianceId: visits.applianceId })
      .from(visits)
      .where(and(eq(visits.companyId, companyId), eq(visits.id, visitId)))
      .limit(1);
    return row ?? null;
  },
  async findComponent(db: DbOrTx, companyId: string, componentId: string) {
    const [row] = await db
      .select({ id: components.id, applianceId: components.applianceId })
      .from(components)
      .where(and(eq(components.companyId, companyId), eq(components.id, componentId)))
      .limit(1);
    return row ?? null;
  },
  /** The same bytes already on this record (same appliance, visit and part). */
  async findSameFile(db: DbOrTx, companyId: string, slot: RecordSlot, sha256: string) {
    const [row] = await db
      .select(withAuthor)
      .from(photos)
      .leftJoin(users, eq(users.id, photos.createdBy))
      .where(
        and(
          eq(photos.companyId, companyId),
          eq(photos.applianceId, slot.applianceId),
          slot.visitId ? eq(photos.visitId, slot.visitId) : isNull(photos.visitId),
          slot.componentId ? eq(photos.componentId, slot.componentId) : isNull(photos.componentId),
          eq(photos.sha256, sha256),
        ),
      )
      .limit(1);
    return row ? flatten(row) : null;
  },
  /** Null when the same file landed on the record in the meantime (the unique constraint decides). */
  async insert(db: DbOrTx, values: typeof photos.$inferInsert): Promise<PhotoRow | null> {
    const [row] = await db.insert(photos).values(values).onConflictDoNothing().returning();
    return row ?? null;
  },
  async list(db: DbOrTx, companyId: string, applianceId: string) {
    const rows = await db
      .select(withAuthor)
      .from(photos)
      .leftJoin(users, eq(users.id, photos.createdBy))
      .where(and(eq(photos.companyId, companyId), eq(photos.applianceId, applianceId)))
      .orderBy(desc(photos.createdAt), desc(photos.id));
    return rows.map(flatten);
  },
  async find(db: DbOrTx, companyId: string, id: string) {
    const [row] = await db
      .select({ ...withAuthor, customerId: sites.customerId })
      .from(photos)
      .innerJoin(appliances, eq(appliances.id, photos.applianceId))
      .innerJoin(sites, eq(sites.id, appliances.siteId))
      .leftJoin(users, eq(users.id, photos.createdBy))
      .where(and(eq(photos.companyId, companyId), eq(photos.id, id)))
      .limit(1);
    return row ? { ...flatten(row), customerId: row.customerId } : null;
  },
  async update(db: DbOrTx, companyId: string, id: string, values: { caption?: string | null; homeownerVisible?: boolean }) {
    const [row] = await db
      .update(photos)
      .set(values)
      .where(and(eq(photos.companyId, companyId), eq(photos.id, id)))
      .returning();
    return row ?? null;
  },
  /** The photo's own timeline entry follows the photo's visibility, so a hidden photo is not announced to the homeowner. */
  async setTimelineVisibility(db: DbOrTx, companyId: string, photoId: string, homeownerVisible: boolean) {
    await db
      .update(timelineEvents)
      .set({ homeownerVisible })
      .where(and(eq(timelineEvents.companyId, companyId), eq(timelineEvents.kind, 'photo'), eq(timelineEvents.refId, photoId)));
  },
  /** Which of these object keys some photo row points at. */
  async referencedKeys(db: DbOrTx, keys: string[]): Promise<Set<string>> {
    if (!keys.length) return new Set();
    const rows = await db
      .select({ displayKey: photos.displayKey, thumbKey: photos.thumbKey })
      .from(photos)
      .where(or(inArray(photos.displayKey, keys), inArray(photos.thumbKey, keys)));
    return new Set(rows.flatMap((r) => [r.displayKey, r.thumbKey]));
  },
};

import { and, asc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { componentCatalog } from '../../db/schema/index';

export type CatalogRow = typeof componentCatalog.$inferSelect;

export const catalogRepository = {
  list(db: DbOrTx, companyId: string) {
    return db.select().from(componentCatalog).where(eq(componentCatalog.companyId, companyId)).orderBy(asc(componentCatalog.group), asc(componentCatalog.label));
  },
  async find(db: DbOrTx, companyId: string, code: string) {
    const [row] = await db
      .select()
      .from(componentCatalog)
      .where(and(eq(componentCatalog.companyId, companyId), eq(componentCatalog.code, code)))
      .limit(1);
    return row ?? null;
  },
  async update(db: DbOrTx, companyId: string, code: string, patch: { label?: string; active?: boolean; updatedBy: string }) {
    const [row] = await db
      .update(componentCatalog)
      .set(patch)
      .where(and(eq(componentCatalog.companyId, companyId), eq(componentCatalog.code, code)))
      .returning();
    return row ?? null;
  },
  /** code → label for the company, including retired types, so old parts keep their names. */
  async labels(db: DbOrTx, companyId: string): Promise<Map<string, { label: string; active: boolean }>> {
    const rows = await db
      .select({ code: componentCatalog.code, label: componentCatalog.label, active: componentCatalog.active })
      .from(componentCatalog)
      .where(eq(componentCatalog.companyId, companyId));
    return new Map(rows.map((r) => [r.code, { label: r.label, active: r.active }]));
  },
};

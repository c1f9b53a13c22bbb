import { and, asc, eq, isNull, or, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { checklistTemplates, type ChecklistItemTemplate, type RequiredReadingsByVisitType } from '../../db/schema/index';
import type { ApplianceKind, Fuel } from '../../../shared/schemas/enums';

export type ChecklistTemplateRow = typeof checklistTemplates.$inferSelect;

/** The template a visit starts from: one for the exact fuel wins over the kind's general (fuel-null) one. */
export async function findTemplateFor(db: DbOrTx, companyId: string, kind: ApplianceKind, fuel: Fuel): Promise<ChecklistTemplateRow | null> {
  const [row] = await db
    .select()
    .from(checklistTemplates)
    .where(
      and(
        eq(checklistTemplates.companyId, companyId),
        eq(checklistTemplates.applianceKind, kind),
        or(eq(checklistTemplates.fuel, fuel), isNull(checklistTemplates.fuel)),
      ),
    )
    .orderBy(sql`${checklistTemplates.fuel} is null`, asc(checklistTemplates.createdAt))
    .limit(1);
  return row ?? null;
}

export const checklistsRepository = {
  list(db: DbOrTx, companyId: string) {
    return db
      .select()
      .from(checklistTemplates)
      .where(eq(checklistTemplates.companyId, companyId))
      .orderBy(asc(checklistTemplates.applianceKind), sql`${checklistTemplates.fuel} nulls first`, asc(checklistTemplates.name));
  },
  async update(db: DbOrTx, companyId: string, id: string, values: { name: string; items: ChecklistItemTemplate[]; requiredReadings?: RequiredReadingsByVisitType; updatedBy: string }) {
    const [row] = await db
      .update(checklistTemplates)
      .set(values)
      .where(and(eq(checklistTemplates.companyId, companyId), eq(checklistTemplates.id, id)))
      .returning();
    return row ?? null;
  },
};

import { and, asc, eq, gt, isNull, lte, ne, or, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { appliances, componentCatalog, components, customers, dueRules, sites, users } from '../../db/schema/index';
import type { ApplianceKind } from '../../../shared/schemas/enums';
import { recomputeDueStatement } from './due-recompute.sql';
import { companyToday } from '../../core/company-today';

// `today` defaults to the company's date by the app's clock (not the database server's), as every other date rule.

/** Rewrites the due date of every present component of one appliance, in one statement. */
export async function recomputeDueForAppliance(db: DbOrTx, companyId: string, applianceId: string, options: { today?: string } = {}): Promise<void> {
  const today = options.today ?? (await companyToday(db, companyId));
  await db.execute(recomputeDueStatement(sql`c.company_id = ${companyId} and c.appliance_id = ${applianceId}`, today));
}

/** Rewrites the due date of every present component of the company, in one statement (after a rule change). */
export async function recomputeDueForCompany(db: DbOrTx, companyId: string, options: { today?: string } = {}): Promise<void> {
  const today = options.today ?? (await companyToday(db, companyId));
  await db.execute(recomputeDueStatement(sql`c.company_id = ${companyId}`, today));
}

export type DueRuleRow = typeof dueRules.$inferSelect;
export type DueRuleChange = Pick<DueRuleRow, 'inspectionIntervalMonths' | 'replacementAgeYears' | 'replacementPolicy' | 'basis' | 'source'> &
  Partial<Pick<DueRuleRow, 'planningAgeYears'>>;

export const dueRepository = {
  listRules(db: DbOrTx, companyId: string) {
    return db
      .select({ rule: dueRules, catalogLabel: componentCatalog.label })
      .from(dueRules)
      .leftJoin(componentCatalog, and(eq(componentCatalog.companyId, dueRules.companyId), eq(componentCatalog.code, dueRules.componentType)))
      .where(eq(dueRules.companyId, companyId))
      .orderBy(asc(dueRules.componentType), sql`${dueRules.applianceKind} nulls first`);
  },
  async findRule(db: DbOrTx, companyId: string, id: string) {
    const [row] = await db
      .select({ rule: dueRules, catalogLabel: componentCatalog.label })
      .from(dueRules)
      .leftJoin(componentCatalog, and(eq(componentCatalog.companyId, dueRules.companyId), eq(componentCatalog.code, dueRules.componentType)))
      .where(and(eq(dueRules.companyId, companyId), eq(dueRules.id, id)))
      .limit(1);
    return row ?? null;
  },
  async updateRule(db: DbOrTx, companyId: string, id: string, change: DueRuleChange, actorId: string) {
    const [row] = await db
      .update(dueRules)
      .set({ ...change, updatedBy: actorId })
      .where(and(eq(dueRules.companyId, companyId), eq(dueRules.id, id)))
      .returning();
    return row ?? null;
  },

  /**
   * Components due through `through`, in (due_on, id) order with a keyset cursor. The company, removed_on and
   * due_on conditions and the ordering follow components_company_due_idx.
   */
  listDue(
    db: DbOrTx,
    q: {
      companyId: string;
      through: string;
      type?: string;
      applianceKind?: ApplianceKind;
      technicianId?: string;
      town?: string;
      after?: { dueOn: string; id: string } | null;
      limit: number;
    },
  ) {
    return db
      .select({
        component: {
          id: components.id,
          typeCode: components.typeCode,
          description: components.description,
          specKey: components.specKey,
          dueOn: components.dueOn,
          dueKind: components.dueKind,
          dueReason: components.dueReason,
          conditionFailed: components.conditionFailed,
        },
        catalogLabel: componentCatalog.label,
        appliance: {
          id: appliances.id,
          kind: appliances.kind,
          fuel: appliances.fuel,
          manufacturer: appliances.manufacturer,
          model: appliances.model,
          location: appliances.location,
        },
        site: { id: sites.id, street: sites.street, town: sites.town, assignedTechnicianId: sites.assignedTechnicianId },
        technicianName: users.name,
        customer: { id: customers.id, name: customers.name },
      })
      .from(components)
      .innerJoin(appliances, and(eq(appliances.id, components.applianceId), eq(appliances.companyId, components.companyId)))
      .innerJoin(sites, eq(sites.id, appliances.siteId))
      .innerJoin(customers, eq(customers.id, sites.customerId))
      .leftJoin(users, eq(users.id, sites.assignedTechnicianId))
      .leftJoin(componentCatalog, and(eq(componentCatalog.companyId, components.companyId), eq(componentCatalog.code, components.typeCode)))
      .where(
        and(
          eq(components.companyId, q.companyId),
          isNull(components.removedOn),
          lte(components.dueOn, q.through),
          ne(appliances.status, 'removed'),
          q.after
            ? or(gt(components.dueOn, q.after.dueOn), and(eq(components.dueOn, q.after.dueOn), gt(components.id, q.after.id)))
            : undefined,
          q.type ? eq(components.typeCode, q.type) : undefined,
          q.applianceKind ? eq(appliances.kind, q.applianceKind) : undefined,
          q.technicianId ? eq(sites.assignedTechnicianId, q.technicianId) : undefined,
          q.town ? sql`lower(${sites.town}) = lower(${q.town})` : undefined,
        ),
      )
      .orderBy(asc(components.dueOn), asc(components.id))
      .limit(q.limit);
  },

  /** Present, working parts that reach their planning median (years by type) by `through`, grouped by type and spec. */
  /**
   * Present, working parts that reach their planning age through `through`: the rule's adopted learned median
   * (kind-specific rule first), else the default median in `medians`.
   */
  async pastMedianLife(db: DbOrTx, companyId: string, through: string, medians: Readonly<Record<string, { years: number }>>) {
    const values = sql.join(Object.entries(medians).map(([type, m]) => sql`(${type}::text, ${m.years}::int)`), sql`, `);
    const result = await db.execute<{ type_code: string; spec_key: string; catalog_label: string | null; count: number }>(sql`
      with medians(type_code, years) as (values ${values}),
      parts as (
        select p.type_code, p.spec_key, cat.label as catalog_label, coalesce(p.installed_on, a.installed_on) as installed,
          coalesce(
            (select dr.planning_age_years from due_rules dr
             where dr.company_id = p.company_id and dr.component_type = p.type_code and (dr.appliance_kind = a.kind or dr.appliance_kind is null)
             order by dr.appliance_kind nulls last limit 1),
            m.years
          ) as years
        from components p
        join appliances a on a.id = p.appliance_id and a.company_id = p.company_id
        left join medians m on m.type_code = p.type_code
        left join component_catalog cat on cat.company_id = p.company_id and cat.code = p.type_code
        where p.company_id = ${companyId} and p.removed_on is null and not p.condition_failed and a.status <> 'removed'
      )
      select type_code, spec_key, catalog_label, count(*)::int as count
      from parts
      where installed is not null and years is not null and (installed + make_interval(years => years))::date <= ${through}::date
      group by type_code, spec_key, catalog_label
      order by type_code, spec_key
    `);
    return result.rows;
  },

  /** Counts of what falls due through `through`, grouped by part type, spec and kind of work: one GROUP BY. */
  stock(db: DbOrTx, companyId: string, through: string) {
    return db
      .select({
        typeCode: components.typeCode,
        specKey: components.specKey,
        dueKind: components.dueKind,
        catalogLabel: componentCatalog.label,
        count: sql<number>`count(*)::int`,
      })
      .from(components)
      .innerJoin(appliances, and(eq(appliances.id, components.applianceId), eq(appliances.companyId, components.companyId)))
      .leftJoin(componentCatalog, and(eq(componentCatalog.companyId, components.companyId), eq(componentCatalog.code, components.typeCode)))
      .where(and(eq(components.companyId, companyId), isNull(components.removedOn), lte(components.dueOn, through), ne(appliances.status, 'removed')))
      .groupBy(components.typeCode, components.specKey, components.dueKind, componentCatalog.label)
      .orderBy(asc(components.typeCode), asc(components.specKey));
  },
};

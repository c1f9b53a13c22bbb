import { readFileSync } from 'node:fs';
import { and, eq, isNull, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { components, dueRules } from '../../server/db/schema/index';
import { insertAppliance, insertComponent, insertSite } from '../../server/db/factories/records';
import { recomputeDueForAppliance } from '../../server/modules/due/due.repository';
import { DEFAULT_DUE_RULES } from '../../shared/trade/due-dates';
import { testApp } from '../support/context';
import { createTenant, type Tenant } from '../support/tenant';

const { ctx } = testApp();
let t: Tenant;
let edited: Tenant;
beforeAll(async () => {
  t = await createTenant(ctx.db);
  edited = await createTenant(ctx.db);
});
afterAll(() => ctx.pool.end());

const ASHRAE = 'ASHRAE Handbook, HVAC Applications, "Owning and Operating Costs" chapter, service-life table (1978 survey), secondary copy';
// The default rule as it was before: the ASHRAE median as a fixed replacement age.
const OLD_CIRCULATOR = {
  replacementPolicy: 'fixed_age' as const,
  replacementAgeYears: 10,
  basis: 'published' as const,
  source: `${ASHRAE}: "pumps, pipe-mounted" median 10 years, used as a planning age (a median, not a prediction); inspected annually (common practice)`,
};

const statements = readFileSync('drizzle/0019_due_rules_age_not_fault.sql', 'utf8').split('--> statement-breakpoint');
const READABLE_REASONS = readFileSync('drizzle/0025_due_reasons_readable_dates.sql', 'utf8').split('--> statement-breakpoint');

type Tx = Parameters<Parameters<typeof ctx.db.transaction>[0]>[0];

async function circulatorRule(db: Tx, companyId: string) {
  const [rule] = await db.select().from(dueRules).where(and(eq(dueRules.companyId, companyId), eq(dueRules.componentType, 'circulator'), isNull(dueRules.applianceKind)));
  return rule;
}

describe('migration 0018: the ASHRAE medians stop being replacement dates for existing companies', () => {
  // The migration runs over every company, so the test runs it inside a transaction it rolls back: other files'
  // tenants in the same database never see it.
  it('turns an untouched old default into the new one, leaves an edited rule alone, and gives the parts the due engine’s own state', async () => {
    const rolledBack = new Error('roll back');
    await expect(ctx.db.transaction(async (tx) => {
      await scenario(tx);
      throw rolledBack;
    })).rejects.toBe(rolledBack);
    // Nothing of it is left: the edited tenant's rule is its seeded default again.
    expect((await circulatorRule(ctx.db as unknown as Tx, edited.company.id)).source).toBe(DEFAULT_DUE_RULES.circulator.source);
  });
});

async function scenario(db: Tx) {
  {
    // Source: ASHRAE service-life table (secondary copy): pumps, pipe-mounted median 10 years, a planning age only.
    for (const tenant of [t, edited]) {
      await db.update(dueRules).set(OLD_CIRCULATOR).where(and(eq(dueRules.companyId, tenant.company.id), eq(dueRules.componentType, 'circulator')));
    }
    await db.update(dueRules).set({ source: 'company policy: circulators at 10 years' }).where(and(eq(dueRules.companyId, edited.company.id), eq(dueRules.componentType, 'circulator')));
    const parts = [];
    for (const tenant of [t, edited]) {
      const site = await insertSite(db, { companyId: tenant.company.id, customerId: tenant.customer.id });
      const appliance = await insertAppliance(db, { companyId: tenant.company.id, siteId: site.id, kind: 'hot_water_boiler', installedOn: '2014-01-10' });
      // An 11-year-old working circulator, stored as "replacement due" by the old rule.
      const part = await insertComponent(db, {
        companyId: tenant.company.id,
        applianceId: appliance.id,
        typeCode: 'circulator',
        lastInspectedOn: '2025-11-20',
        dueOn: '2024-01-10',
        dueKind: 'replacement',
        dueReason: 'replacement age 10 years (original with the appliance, installed 2014-01-10)',
      });
      parts.push({ tenant, appliance, part });
    }

    for (const s of statements) await db.execute(sql.raw(s));

    expect(await circulatorRule(db, t.company.id)).toMatchObject({
      replacementPolicy: 'on_condition',
      replacementAgeYears: null,
      inspectionIntervalMonths: 12,
      basis: DEFAULT_DUE_RULES.circulator.basis,
      source: DEFAULT_DUE_RULES.circulator.source,
    });
    expect(await circulatorRule(db, edited.company.id)).toMatchObject({ replacementPolicy: 'fixed_age', replacementAgeYears: 10, source: 'company policy: circulators at 10 years' });

    const [migrated] = await db.select().from(components).where(eq(components.id, parts[0].part.id));
    expect(migrated).toMatchObject({ dueOn: '2026-11-20', dueKind: 'inspection', dueReason: 'every 12 months since last inspection 2025-11-20' });
    const [untouched] = await db.select().from(components).where(eq(components.id, parts[1].part.id));
    expect(untouched).toMatchObject({ dueOn: '2024-01-10', dueKind: 'replacement' });

    // The later migration 0025 (run after it in order) says the stored date in words, as the due engine now writes it.
    for (const s of READABLE_REASONS) await db.execute(sql.raw(s));
    const [readable] = await db.select().from(components).where(eq(components.id, parts[0].part.id));
    expect(readable.dueReason).toBe('every 12 months since last inspection Nov 20, 2025');

    // The due engine, run again over the migrated part, finds nothing to change.
    await recomputeDueForAppliance(db, t.company.id, parts[0].appliance.id, { today: '2026-12-03' });
    const [again] = await db.select().from(components).where(eq(components.id, parts[0].part.id));
    expect(again).toMatchObject({ dueOn: migrated.dueOn, dueKind: migrated.dueKind, dueReason: readable.dueReason });
  }
}

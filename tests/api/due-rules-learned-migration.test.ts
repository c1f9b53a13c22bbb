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
let own: Tenant;
beforeAll(async () => {
  t = await createTenant(ctx.db);
  own = await createTenant(ctx.db);
});
afterAll(() => ctx.pool.end());

// A learned median as adopted before the migration: a fixed replacement age (the invented swap counts are the demo's).
const OLD_LEARNED = {
  replacementPolicy: 'fixed_age' as const,
  replacementAgeYears: 6,
  inspectionIntervalMonths: null,
  basis: 'learned' as const,
  source: 'Learned from 36 swaps, 2012–2017: Kaplan–Meier median 5.6 years (95 % CI 5.1–6.2 years; Greenwood, log-log), 80 parts at risk.',
};

// The column itself is already in the test database; the test runs the statement that converts the rules.
const [, convert] = readFileSync('drizzle/0021_due_rules_learned_planning_age.sql', 'utf8').split('--> statement-breakpoint');
const READABLE_REASONS = readFileSync('drizzle/0025_due_reasons_readable_dates.sql', 'utf8').split('--> statement-breakpoint');

type Tx = Parameters<Parameters<typeof ctx.db.transaction>[0]>[0];

async function thermocoupleRule(db: Tx, companyId: string) {
  const [rule] = await db.select().from(dueRules).where(and(eq(dueRules.companyId, companyId), eq(dueRules.componentType, 'thermocouple'), isNull(dueRules.applianceKind)));
  return rule;
}

describe('migration 0020: an adopted learned median stops being a replacement date', () => {
  // Runs over every company, so inside a transaction that is rolled back (other files' tenants never see it).
  it('turns the learned fixed age into a planning age, leaves a company’s own fixed age alone, and gives the parts the due engine’s state', async () => {
    const rolledBack = new Error('roll back');
    await expect(ctx.db.transaction(async (tx) => {
      await scenario(tx);
      throw rolledBack;
    })).rejects.toBe(rolledBack);
    expect((await thermocoupleRule(ctx.db as unknown as Tx, t.company.id)).source).toBe(DEFAULT_DUE_RULES.thermocouple.source);
  });
});

async function scenario(db: Tx) {
  await db.update(dueRules).set(OLD_LEARNED).where(and(eq(dueRules.companyId, t.company.id), eq(dueRules.componentType, 'thermocouple')));
  const companyPolicy = { ...OLD_LEARNED, basis: 'company_policy' as const, source: 'company policy: thermocouples at 6 years' };
  await db.update(dueRules).set(companyPolicy).where(and(eq(dueRules.companyId, own.company.id), eq(dueRules.componentType, 'thermocouple')));
  const parts = [];
  for (const tenant of [t, own]) {
    const site = await insertSite(db, { companyId: tenant.company.id, customerId: tenant.customer.id });
    const appliance = await insertAppliance(db, { companyId: tenant.company.id, siteId: site.id, kind: 'steam_boiler', installedOn: '2019-04-02' });
    // A 7-year-old working thermocouple, stored as "replacement due" by the old rule.
    const part = await insertComponent(db, {
      companyId: tenant.company.id,
      applianceId: appliance.id,
      typeCode: 'thermocouple',
      lastInspectedOn: '2025-10-14',
      dueOn: '2025-04-02',
      dueKind: 'replacement',
      dueReason: 'replacement age 6 years (original with the appliance, installed 2019-04-02)',
    });
    parts.push({ appliance, part });
  }

  await db.execute(sql.raw(convert));

  const rule = await thermocoupleRule(db, t.company.id);
  expect(rule).toMatchObject({ replacementPolicy: 'on_condition', replacementAgeYears: null, planningAgeYears: 6, inspectionIntervalMonths: 12, basis: 'learned' });
  expect(rule.source).toBe(`${OLD_LEARNED.source} Adopted as a planning age (inspect and plan), not a replacement date: medians describe populations, not one unit.`);
  expect(await thermocoupleRule(db, own.company.id)).toMatchObject({ replacementPolicy: 'fixed_age', replacementAgeYears: 6, planningAgeYears: null, source: companyPolicy.source });

  const [migrated] = await db.select().from(components).where(eq(components.id, parts[0].part.id));
  expect(migrated).toMatchObject({ dueOn: '2026-10-14', dueKind: 'inspection', dueReason: 'every 12 months since last inspection 2025-10-14' });
  const [untouched] = await db.select().from(components).where(eq(components.id, parts[1].part.id));
  expect(untouched).toMatchObject({ dueOn: '2025-04-02', dueKind: 'replacement' });

  // The later migration 0025 (run after it in order) says the stored date in words, as the due engine now writes it.
  for (const s of READABLE_REASONS) await db.execute(sql.raw(s));
  const [readable] = await db.select().from(components).where(eq(components.id, parts[0].part.id));
  expect(readable.dueReason).toBe('every 12 months since last inspection Oct 14, 2025');

  // The due engine, run again over the migrated part, finds nothing to change.
  await recomputeDueForAppliance(db, t.company.id, parts[0].appliance.id, { today: '2026-12-03' });
  const [again] = await db.select().from(components).where(eq(components.id, parts[0].part.id));
  expect(again).toMatchObject({ dueOn: migrated.dueOn, dueKind: migrated.dueKind, dueReason: readable.dueReason });
}

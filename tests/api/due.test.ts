import { and, eq } from 'drizzle-orm';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DbOrTx } from '../../server/db/client';
import { appliances, auditLog, components, dueRules, sites } from '../../server/db/schema/index';
import { dueRepository, recomputeDueForCompany } from '../../server/modules/due/due.repository';
import { describeStoredDue } from '../../server/modules/due/due-status';
import { applyDemoCompanyPolicies } from '../../server/db/seed/demo-company-policies';
import { todayInTimeZone } from '../../shared/dates';
import type { ApplianceKind } from '../../shared/schemas/enums';
import { addDays, addMonths, computeComponentDue, type ComponentType, type DueRule } from '../../shared/trade/index';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';
import { runFileAt } from '../support/clock';

const { app, ctx } = testApp();
// A Wednesday noon in the company's zone: "today" and every date worked out from it stay put while the file runs.
runFileAt('2026-11-18T12:00:00-05:00');
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
});
afterAll(() => ctx.pool.end());

// ---- minimal local builders (the shared record factories belong to the records work) -------------------------------

async function site(db: DbOrTx, tenant: Tenant, values: { town?: string; assignedTechnicianId?: string | null } = {}) {
  const [row] = await db
    .insert(sites)
    .values({ companyId: tenant.company.id, customerId: tenant.customer.id, street: '12 Lantern Row', town: values.town ?? 'Wrenfield', ...values })
    .returning();
  return row;
}

async function appliance(db: DbOrTx, tenant: Tenant, siteId: string, values: { kind?: ApplianceKind; installedOn?: string | null } = {}) {
  const [row] = await db
    .insert(appliances)
    .values({
      companyId: tenant.company.id,
      siteId,
      kind: values.kind ?? 'steam_boiler',
      fuel: 'natural_gas',
      construction: 'cast_iron',
      ignitionType: 'standing_pilot',
      ventType: 'draft_hood',
      installedOn: values.installedOn ?? null,
    })
    .returning();
  return row;
}

type ComponentValues = Partial<typeof components.$inferInsert> & { typeCode: string };
async function component(db: DbOrTx, tenant: Tenant, applianceId: string, values: ComponentValues) {
  const [row] = await db
    .insert(components)
    .values({ companyId: tenant.company.id, applianceId, ...values })
    .returning();
  return row;
}

async function storedComponent(id: string) {
  const [row] = await ctx.db.select().from(components).where(eq(components.id, id));
  return row;
}

/** The company's rules as computeComponentDue takes them, resolved the way the SQL resolves them. */
async function jsRuleFor(companyId: string, typeCode: string, kind: ApplianceKind): Promise<DueRule> {
  const rows = await ctx.db.select().from(dueRules).where(and(eq(dueRules.companyId, companyId), eq(dueRules.componentType, typeCode)));
  const row = rows.find((r) => r.applianceKind === kind) ?? rows.find((r) => r.applianceKind === null)!;
  return {
    componentType: row.componentType as ComponentType,
    applianceKind: row.applianceKind ?? undefined,
    inspectionIntervalMonths: row.inspectionIntervalMonths,
    replacementAgeYears: row.replacementAgeYears,
    replacementPolicy: row.replacementPolicy,
    basis: row.basis,
    source: row.source,
  };
}

/** Compares every present component of the company with computeComponentDue on `today`. */
async function expectSqlMatchesComputeComponentDue(companyId: string, today: string) {
  const rows = await ctx.db
    .select({ c: components, applianceInstalledOn: appliances.installedOn, kind: appliances.kind })
    .from(components)
    .innerJoin(appliances, eq(appliances.id, components.applianceId))
    .where(eq(components.companyId, companyId));
  let compared = 0;
  for (const { c, applianceInstalledOn, kind } of rows) {
    if (c.removedOn) continue;
    const expected = computeComponentDue({
      rule: await jsRuleFor(companyId, c.typeCode, kind),
      installedOn: c.installedOn,
      applianceInstalledOn,
      lastInspectedOn: c.lastInspectedOn,
      conditionFailed: c.conditionFailed,
      today,
      horizonDays: 30,
    });
    const label = `${c.typeCode} ${JSON.stringify({ installedOn: c.installedOn, applianceInstalledOn, last: c.lastInspectedOn, failed: c.conditionFailed })}`;
    expect({ dueOn: c.dueOn, dueKind: c.dueKind }, label).toEqual({ dueOn: expected.nextDue?.dueOn ?? null, dueKind: expected.nextDue?.kind ?? null });
    if (expected.nextDue) {
      expect(describeStoredDue(c, today, 30), label).toEqual({ status: expected.status, reason: expected.reason });
    } else {
      expect(c.dueReason, label).toBe(expected.reason);
    }
    compared += 1;
  }
  return compared;
}

describe('due engine: SQL agrees with computeComponentDue', () => {
  const today = '2026-06-15';

  it('for a hand-built set covering every policy, a kind-specific rule and month-end dates', async () => {
    const tenant = await createTenant(ctx.db);
    const s = await site(ctx.db, tenant);
    const steam = await appliance(ctx.db, tenant, s.id, { kind: 'steam_boiler', installedOn: '2010-10-01' });
    const furnace = await appliance(ctx.db, tenant, s.id, { kind: 'furnace', installedOn: null });
    // A kind-specific rule for steam boilers must win over the every-kind thermocouple rule.
    await ctx.db.insert(dueRules).values({
      companyId: tenant.company.id,
      componentType: 'thermocouple',
      applianceKind: 'steam_boiler',
      inspectionIntervalMonths: 12,
      replacementAgeYears: 5,
      replacementPolicy: 'fixed_age',
      basis: 'company_policy',
      source: 'Company policy (test)',
    });
    // An on-condition rule with no inspection interval.
    await ctx.db
      .update(dueRules)
      .set({ inspectionIntervalMonths: null })
      .where(and(eq(dueRules.companyId, tenant.company.id), eq(dueRules.componentType, 'radiator_air_vent')));

    const built = [
      // fixed_age (published median), original with the appliance, never inspected
      [steam.id, { typeCode: 'burners', originalWithAppliance: true }],
      // fixed_age with no install date anywhere: replacement unknown, inspection due today
      [furnace.id, { typeCode: 'burners' }],
      // annual, own install date on a month end (2024-02-29 + 12 months = 2025-02-28)
      [steam.id, { typeCode: 'nozzle', installedOn: '2024-02-29' }],
      [steam.id, { typeCode: 'oil_filter', installedOn: '2026-01-31', lastInspectedOn: '2026-03-31' }],
      // on_condition: inspection after the last inspection, and last inspection equal to the install date
      [furnace.id, { typeCode: 'thermocouple', installedOn: '2025-08-31', lastInspectedOn: '2025-09-30' }],
      [furnace.id, { typeCode: 'flame_sensor', installedOn: '2025-07-01', lastInspectedOn: '2025-07-01' }],
      [furnace.id, { typeCode: 'gas_valve', installedOn: '2025-07-01', lastInspectedOn: '2024-01-01' }],
      // kind-specific fixed_age: replacement (2021-05-10 + 5 y) comes before the inspection
      [steam.id, { typeCode: 'thermocouple', installedOn: '2021-05-10', lastInspectedOn: '2026-01-10' }],
      // a tie between replacement and inspection: the replacement wins
      [steam.id, { typeCode: 'circulator', installedOn: '2016-06-15', lastInspectedOn: '2025-06-15' }],
      // on_condition without inspections: nothing scheduled
      [steam.id, { typeCode: 'radiator_air_vent', installedOn: '2020-01-01' }],
      // condition failed: replace today, whatever the dates say
      [steam.id, { typeCode: 'gauge_glass', installedOn: '2025-12-01', conditionFailed: true, conditionNote: 'cracked' }],
      [furnace.id, { typeCode: 'nozzle', conditionFailed: true }],
    ] as const;
    for (const [applianceId, values] of built) await component(ctx.db, tenant, applianceId, values);
    await recomputeDueForCompany(ctx.db, tenant.company.id, { today });

    expect(await expectSqlMatchesComputeComponentDue(tenant.company.id, today)).toBe(built.length);
    const [steamThermocouple] = await ctx.db
      .select()
      .from(components)
      .where(and(eq(components.applianceId, steam.id), eq(components.typeCode, 'thermocouple')));
    expect(steamThermocouple).toMatchObject({ dueOn: '2026-05-10', dueKind: 'replacement', dueReason: 'replacement age 5 years (installed May 10, 2021)' });
  });

  it('for a random set of dates, conditions and types', async () => {
    const tenant = await createTenant(ctx.db);
    const s = await site(ctx.db, tenant);
    const day = fc.integer({ min: 0, max: 40 * 365 }).map((n) => addDays('1986-06-16', n));
    const types = ['burners', 'circulator', 'nozzle', 'oil_filter', 'thermocouple', 'safety_valve', 'gauge_glass'] as const;
    const cases = fc.sample(
      fc.record({
        kind: fc.constantFrom<ApplianceKind>('steam_boiler', 'hot_water_boiler', 'furnace'),
        applianceInstalledOn: fc.option(day),
        installedOn: fc.option(day),
        lastInspectedOn: fc.option(day),
        conditionFailed: fc.boolean(),
        typeCode: fc.constantFrom(...types),
      }),
      { numRuns: 60, seed: 20261201 },
    );
    for (const c of cases) {
      const a = await appliance(ctx.db, tenant, s.id, { kind: c.kind, installedOn: c.applianceInstalledOn });
      await component(ctx.db, tenant, a.id, { typeCode: c.typeCode, installedOn: c.installedOn, lastInspectedOn: c.lastInspectedOn, conditionFailed: c.conditionFailed });
    }
    await recomputeDueForCompany(ctx.db, tenant.company.id, { today });
    expect(await expectSqlMatchesComputeComponentDue(tenant.company.id, today)).toBe(cases.length);
  });
});

describe('GET /api/due: the tenant-wide due list', () => {
  let today: string;
  const ids: Record<string, string> = {};

  beforeAll(async () => {
    today = todayInTimeZone(t.company.timeZone);
    const north = await site(ctx.db, t, { town: 'Wrenfield', assignedTechnicianId: t.technician.user.id });
    const east = await site(ctx.db, t, { town: 'East Wrenfield' });
    const steam = await appliance(ctx.db, t, north.id, { kind: 'steam_boiler', installedOn: '2015-09-01' });
    const water = await appliance(ctx.db, t, east.id, { kind: 'hot_water_boiler', installedOn: '2015-09-01' });
    const tc24 = { lengthIn: 24 };
    const lastYear = addMonths(today, -12);
    const make = async (name: string, applianceId: string, values: ComponentValues) => {
      ids[name] = (await component(ctx.db, t, applianceId, { installedOn: '2020-01-01', ...values })).id;
    };
    // Thermocouples are inspected every 12 months (default rule, on condition).
    await make('dueToday', steam.id, { typeCode: 'thermocouple', spec: tc24, specKey: '24 in', lastInspectedOn: lastYear });
    await make('dueIn30', water.id, { typeCode: 'thermocouple', spec: tc24, specKey: '24 in', lastInspectedOn: addDays(lastYear, 30) });
    await make('overdue', water.id, { typeCode: 'thermocouple', spec: { lengthIn: 30 }, specKey: '30 in', lastInspectedOn: addMonths(today, -15) });
    await make('conditionFailed', steam.id, { typeCode: 'gauge_glass', spec: { lengthIn: 12 }, specKey: '12 in', lastInspectedOn: today, conditionFailed: true });
    await make('later', steam.id, { typeCode: 'safety_valve', lastInspectedOn: addDays(lastYear, 200) });
    await make('replaced', steam.id, { typeCode: 'relief_valve', lastInspectedOn: addMonths(today, -30), removedOn: addDays(today, -3) });
    await make('replacement', steam.id, { typeCode: 'relief_valve', installedOn: addDays(today, -3) });
    await recomputeDueForCompany(ctx.db, t.company.id);
    await ctx.db.update(components).set({ replacedById: ids.replacement }).where(eq(components.id, ids.replaced));

    // Another tenant's overdue part must never be counted.
    const otherSite = await site(ctx.db, other);
    const otherAppliance = await appliance(ctx.db, other, otherSite.id, { installedOn: '2015-01-01' });
    ids.otherTenant = (await component(ctx.db, other, otherAppliance.id, { typeCode: 'thermocouple', specKey: '24 in', lastInspectedOn: '2020-01-01' })).id;
    await recomputeDueForCompany(ctx.db, other.company.id);
  });

  it('returns exactly the parts due or overdue through today + N days, in due order', async () => {
    const res = await as.technician.get('/api/due').query({ withinDays: 90 });
    expect(res.status).toBe(200);
    const got = res.body.items.map((i: { componentId: string }) => i.componentId);
    expect(got.sort()).toEqual([ids.dueToday, ids.dueIn30, ids.overdue, ids.conditionFailed].sort());
    const dates = res.body.items.map((i: { dueOn: string }) => i.dueOn);
    expect(dates).toEqual([...dates].sort());
    const byId = Object.fromEntries(res.body.items.map((i: { componentId: string }) => [i.componentId, i]));
    expect(byId[ids.overdue]).toMatchObject({ status: 'overdue', dueKind: 'inspection', typeLabel: 'thermocouple', specKey: '30 in' });
    expect(byId[ids.conditionFailed]).toMatchObject({ status: 'replace_now', dueKind: 'replacement', dueOn: today });
    expect(byId[ids.dueIn30]).toMatchObject({ status: 'due_soon', dueOn: addMonths(addDays(lastYearOf(today), 30), 12) });
    expect(byId[ids.dueToday]).toMatchObject({
      site: { town: 'Wrenfield', assignedTechnicianId: t.technician.user.id, assignedTechnicianName: t.technician.user.name },
      customer: { id: t.customer.id, name: t.customer.name },
      appliance: { kind: 'steam_boiler' },
    });
    expect(byId[ids.dueToday].reason).toMatch(/^Inspection (is due today|was due)/);
    expect(res.body.nextCursor).toBeNull();
  });

  it('widens with withinDays and leaves removed parts out', async () => {
    const res = await as.manager.get('/api/due').query({ withinDays: 300 });
    const got = res.body.items.map((i: { componentId: string }) => i.componentId);
    expect(got).toContain(ids.later);
    expect(got).not.toContain(ids.replaced);
    expect(got).not.toContain(ids.replacement);
    expect(got).not.toContain(ids.otherTenant);
    const [replaced] = await ctx.db.select().from(components).where(eq(components.id, ids.replaced));
    expect(replaced.removedOn).not.toBeNull();
  });

  it('filters by type, technician, town and appliance kind', async () => {
    const ofType = await as.manager.get('/api/due').query({ type: 'gauge_glass' });
    expect(ofType.body.items.map((i: { componentId: string }) => i.componentId)).toEqual([ids.conditionFailed]);
    const mine = await as.manager.get('/api/due').query({ technicianId: t.technician.user.id });
    expect(mine.body.items.map((i: { componentId: string }) => i.componentId).sort()).toEqual([ids.dueToday, ids.conditionFailed].sort());
    const east = await as.manager.get('/api/due').query({ town: 'east wrenfield' });
    expect(east.body.items.map((i: { componentId: string }) => i.componentId).sort()).toEqual([ids.dueIn30, ids.overdue].sort());
    const water = await as.manager.get('/api/due').query({ applianceKind: 'hot_water_boiler' });
    expect(water.body.items).toHaveLength(2);
  });

  it('pages with a keyset cursor that visits every item once, in order', async () => {
    const all = (await as.manager.get('/api/due').query({ withinDays: 300 })).body.items.map((i: { componentId: string }) => i.componentId);
    const seen: string[] = [];
    let after: string | undefined;
    do {
      const res = await as.manager.get('/api/due').query({ withinDays: 300, limit: 2, ...(after ? { after } : {}) });
      expect(res.status).toBe(200);
      expect(res.body.items.length).toBeLessThanOrEqual(2);
      seen.push(...res.body.items.map((i: { componentId: string }) => i.componentId));
      after = res.body.nextCursor ?? undefined;
    } while (after);
    expect(seen).toEqual(all);
    expect(all).toHaveLength(5);
  });

  it('answers bad queries with field errors, homeowners 403, signed out 401', async () => {
    const bad = await as.manager.get('/api/due').query({ withinDays: -1, applianceKind: 'kettle' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['applianceKind', 'withinDays']);
    expect((await as.manager.get('/api/due').query({ after: 'nonsense' })).status).toBe(400);
    expect((await as.homeowner.get('/api/due')).status).toBe(403);
    expect((await as.anonymous.get('/api/due')).status).toBe(401);
    expect((await as.homeowner.get('/api/due/stock')).status).toBe(403);
  });

  it('reads through components_company_due_idx (company, due date, id) for present parts', async () => {
    const query = dueRepository.listDue(ctx.db, { companyId: t.company.id, through: addDays(today, 90), after: { dueOn: today, id: ids.dueToday }, limit: 101 }).toSQL();
    const client = await ctx.pool.connect();
    try {
      await client.query('begin');
      // The test tables are tiny, where a sequential scan is cheaper; forbid it to see which index the plan can use.
      await client.query('set local enable_seqscan = off');
      const plan = await client.query(`explain ${query.sql}`, query.params);
      await client.query('rollback');
      const text = plan.rows.map((r: Record<string, string>) => r['QUERY PLAN']).join('\n');
      expect(text).toMatch(/Index (Only )?Scan using components_company_due_idx on components/);
    } finally {
      client.release();
    }
  });

  it('counts stock by part type and spec, replacements and inspections apart', async () => {
    const res = await as.technician.get('/api/due/stock').query({ withinDays: 90 });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      withinDays: 90,
      through: addDays(today, 90),
      replacements: [{ typeCode: 'gauge_glass', typeLabel: 'gauge glass', specKey: '12 in', count: 1 }],
      inspections: [
        { typeCode: 'thermocouple', typeLabel: 'thermocouple', specKey: '24 in', count: 2 },
        { typeCode: 'thermocouple', typeLabel: 'thermocouple', specKey: '30 in', count: 1 },
      ],
      pastMedianLife: [],
      pastMedianLifeSource: expect.stringMatching(/ASHRAE/),
    });
  });
});

describe('GET /api/due/stock: working parts past their median life are planned for, never due by age', () => {
  // Source: ASHRAE Handbook, HVAC Applications, service-life table (secondary copy): pumps, pipe-mounted median
  // 10 years; burners 21 years. The medians describe populations, not one unit.
  it('lists working circulators and burners that reach their median by the window’s end, apart from what is due', async () => {
    const p = await createTenant(ctx.db);
    const agent = (await agentsFor(app, p)).technician;
    const today = todayInTimeZone(p.company.timeZone);
    const home = await site(ctx.db, p);
    const old = await appliance(ctx.db, p, home.id, { kind: 'hot_water_boiler', installedOn: addDays(addMonths(today, -120), 30) });
    const young = await appliance(ctx.db, p, home.id, { kind: 'hot_water_boiler', installedOn: addMonths(today, -60) });
    const aging = await component(ctx.db, p, old.id, { typeCode: 'circulator', lastInspectedOn: addMonths(today, -2) });
    await component(ctx.db, p, old.id, { typeCode: 'burners', installedOn: addDays(addMonths(today, -252), -1), lastInspectedOn: addMonths(today, -2) });
    await component(ctx.db, p, young.id, { typeCode: 'circulator', lastInspectedOn: addMonths(today, -2) });
    await component(ctx.db, p, old.id, { typeCode: 'circulator', specKey: 'failed', lastInspectedOn: today, conditionFailed: true });
    await recomputeDueForCompany(ctx.db, p.company.id);

    const res = await agent.get('/api/due/stock').query({ withinDays: 60 });
    expect(res.status).toBe(200);
    expect(res.body.pastMedianLife).toEqual([
      { typeCode: 'burners', typeLabel: expect.any(String), specKey: '', count: 1 },
      { typeCode: 'circulator', typeLabel: expect.any(String), specKey: '', count: 1 },
    ]);
    expect(res.body.pastMedianLifeSource).toMatch(/ASHRAE.*not a fault/);
    // The failed one is a replacement (condition); the aging working one is not, and is due only for inspection.
    expect(res.body.replacements).toEqual([{ typeCode: 'circulator', typeLabel: expect.any(String), specKey: 'failed', count: 1 }]);
    const [stored] = await ctx.db.select().from(components).where(eq(components.id, aging.id));
    expect(stored).toMatchObject({ dueKind: 'inspection', dueOn: addMonths(addMonths(today, -2), 12) });
    // Before the circulator turns ten, it is not in the plan.
    const sooner = await agent.get('/api/due/stock').query({ withinDays: 10 });
    expect(sooner.body.pastMedianLife.map((r: { typeCode: string }) => r.typeCode)).toEqual(['burners']);
  });
});

const lastYearOf = (today: string) => addMonths(today, -12);

describe('due rules', () => {
  it('lists the company’s rules, seeded from the defaults with their sources', async () => {
    const res = await as.technician.get('/api/due-rules');
    expect(res.status).toBe(200);
    const nozzle = res.body.find((r: { componentType: string }) => r.componentType === 'nozzle');
    expect(nozzle).toMatchObject({ replacementPolicy: 'annual', basis: 'common_practice', applianceKind: null, typeLabel: 'oil burner nozzle' });
    expect(res.body.every((r: { source: string }) => r.source.length > 0)).toBe(true);
    expect((await as.homeowner.get('/api/due-rules')).status).toBe(403);
  });

  it('a manager’s rule edit recomputes the company’s due dates in the same request', async () => {
    const tenant = await createTenant(ctx.db);
    const agents = await agentsFor(app, tenant);
    const s = await site(ctx.db, tenant);
    const a = await appliance(ctx.db, tenant, s.id, { installedOn: '2018-01-01' });
    const today = todayInTimeZone(tenant.company.timeZone);
    const part = await component(ctx.db, tenant, a.id, { typeCode: 'thermocouple', installedOn: addMonths(today, -26), lastInspectedOn: addMonths(today, -2) });
    await recomputeDueForCompany(ctx.db, tenant.company.id);
    expect(await storedComponent(part.id)).toMatchObject({ dueKind: 'inspection', dueOn: addMonths(addMonths(today, -2), 12) });

    const [rule] = await ctx.db
      .select()
      .from(dueRules)
      .where(and(eq(dueRules.companyId, tenant.company.id), eq(dueRules.componentType, 'thermocouple')));
    const change = { inspectionIntervalMonths: 12, replacementAgeYears: 2, replacementPolicy: 'fixed_age', basis: 'company_policy', source: 'Company policy: two years' };
    const res = await agents.manager.put(`/api/due-rules/${rule.id}`).send(change);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: rule.id, ...change });
    const [stored] = await ctx.db.select().from(dueRules).where(eq(dueRules.id, rule.id));
    expect(stored).toMatchObject({ ...change, updatedBy: tenant.manager.user.id });
    expect(await storedComponent(part.id)).toMatchObject({ dueKind: 'replacement', dueOn: addMonths(addMonths(today, -26), 24) });
    const audits = await ctx.db.select().from(auditLog).where(eq(auditLog.entityId, rule.id));
    expect(audits.map((x) => x.action)).toEqual(['update']);

    const listed = await agents.manager.get('/api/due').query({ withinDays: 0 });
    expect(listed.body.items.map((i: { componentId: string }) => i.componentId)).toEqual([part.id]);
    expect(listed.body.items[0].status).toBe('overdue');
  });

  it('refuses technicians (403), other tenants (404) and incomplete rules (400), changing nothing', async () => {
    const [rule] = await ctx.db.select().from(dueRules).where(and(eq(dueRules.companyId, t.company.id), eq(dueRules.componentType, 'circulator')));
    const valid = { inspectionIntervalMonths: 6, replacementAgeYears: null, replacementPolicy: 'on_condition', basis: 'company_policy', source: 'Company policy' };
    expect((await as.technician.put(`/api/due-rules/${rule.id}`).send(valid)).status).toBe(403);
    expect((await as.homeowner.put(`/api/due-rules/${rule.id}`).send(valid)).status).toBe(403);
    expect((await as.anonymous.put(`/api/due-rules/${rule.id}`).send(valid)).status).toBe(401);

    const [otherRule] = await ctx.db.select().from(dueRules).where(eq(dueRules.companyId, other.company.id)).limit(1);
    expect((await as.manager.put(`/api/due-rules/${otherRule.id}`).send(valid)).status).toBe(404);

    const bad = await as.manager.put(`/api/due-rules/${rule.id}`).send({ ...valid, replacementPolicy: 'fixed_age', basis: undefined, source: ' ' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['basis', 'replacementAgeYears', 'source']);

    const [after] = await ctx.db.select().from(dueRules).where(eq(dueRules.id, rule.id));
    expect(after).toEqual(rule);
    const [otherAfter] = await ctx.db.select().from(dueRules).where(eq(dueRules.id, otherRule.id));
    expect(otherAfter).toEqual(otherRule);
  });
});

describe('demo company policies', () => {
  it('layer company replacement ages over the defaults, and twice is the same as once', async () => {
    const tenant = await createTenant(ctx.db);
    await ctx.db.transaction((tx) => applyDemoCompanyPolicies(tx, tenant.company.id));
    await ctx.db.transaction((tx) => applyDemoCompanyPolicies(tx, tenant.company.id));
    const rules = await ctx.db.select().from(dueRules).where(eq(dueRules.companyId, tenant.company.id));
    const policy = rules.filter((r) => r.basis === 'company_policy');
    expect(policy.map((r) => [r.componentType, r.applianceKind, r.replacementAgeYears]).sort()).toEqual(
      [
        ['pilot_assembly', null, 10],
        ['thermocouple', 'hot_water_boiler', 5],
        ['thermocouple', 'steam_boiler', 5],
      ].sort(),
    );
    expect(policy.every((r) => r.source === 'Company policy (demo)' && r.replacementPolicy === 'fixed_age')).toBe(true);
    // The every-kind thermocouple rule stays as it was, for furnaces and water heaters.
    expect(rules.find((r) => r.componentType === 'thermocouple' && r.applianceKind === null)).toMatchObject({ replacementPolicy: 'on_condition' });
    expect(rules.filter((r) => r.componentType === 'nozzle')).toMatchObject([{ replacementPolicy: 'annual' }]);

    const s = await site(ctx.db, tenant);
    const steam = await appliance(ctx.db, tenant, s.id, { kind: 'steam_boiler', installedOn: '2010-01-01' });
    const furnace = await appliance(ctx.db, tenant, s.id, { kind: 'furnace', installedOn: '2010-01-01' });
    const onSteam = await component(ctx.db, tenant, steam.id, { typeCode: 'thermocouple', installedOn: '2020-03-01', lastInspectedOn: '2026-01-01' });
    const onFurnace = await component(ctx.db, tenant, furnace.id, { typeCode: 'thermocouple', installedOn: '2020-03-01', lastInspectedOn: '2026-01-01' });
    await recomputeDueForCompany(ctx.db, tenant.company.id, { today: '2026-06-15' });
    expect(await storedComponent(onSteam.id)).toMatchObject({ dueKind: 'replacement', dueOn: '2025-03-01' });
    expect(await storedComponent(onFurnace.id)).toMatchObject({ dueKind: 'inspection', dueOn: '2027-01-01' });
  });
});

import { and, eq, isNull } from 'drizzle-orm';
import { swappedPart } from '../support/swap-history';
import { describe, expect, it, beforeAll } from 'vitest';
import { auditLog, components, dueRules } from '../../server/db/schema/index';
import type { ServiceLifeDto } from '../../shared/schemas/service-life';
import { kaplanMeier, medianSurvival } from '../../shared/stats/kaplan-meier';
import { testApp } from '../support/context';
import { runFileAt } from '../support/clock';
import { createTenant, type Tenant } from '../support/tenant';
import { useTenantWithBoiler } from '../support/tenant-fixture';

const { app, ctx } = testApp();
runFileAt('2026-11-18T12:00:00-05:00');
const fx = useTenantWithBoiler(app, ctx);
let other: Tenant;

const thermocouple = async (as: typeof fx.as.manager) => {
  const res = await as.get('/api/service-life').query({ type: 'thermocouple' }).expect(200);
  return (res.body as ServiceLifeDto[])[0];
};

beforeAll(async () => {
  other = await createTenant(ctx.db);
  // 36 thermocouples worn out at ages 2…7 years (6 at each), their boilers replaced whole in 2018 (the fresh parts
  // censored at 6…1 years); 4 swapped for an upgrade at 1 year, the fresh parts still in service (10.7 years).
  for (let i = 0; i < 36; i += 1) await swappedPart(ctx.db, fx.t, 'thermocouple', '2010-03-01', `${2012 + (i % 6)}-03-01`, 'wear_or_failure', '2018-03-01');
  for (let i = 0; i < 4; i += 1) await swappedPart(ctx.db, fx.t, 'thermocouple', '2015-03-01', '2016-03-01', 'upgrade');
  for (let i = 0; i < 3; i += 1) await swappedPart(ctx.db, fx.t, 'flame_sensor', '2012-03-01', '2019-03-01', 'wear_or_failure');
  // Another company's worn-out thermocouples never count here.
  for (let i = 0; i < 5; i += 1) await swappedPart(ctx.db, other, 'thermocouple', '2010-03-01', '2011-03-01', 'wear_or_failure');
}, 60_000);

describe('GET /service-life', () => {
  it('counts wear-or-failure swaps as events and everything else as censored, for this company only', async () => {
    const e = await thermocouple(fx.as.technician);
    // The fixture boiler's own parts have no thermocouple, so: 36 worn + 4 upgraded + 40 fresh in service.
    expect(e).toMatchObject({ componentType: 'thermocouple', events: 36, atRisk: 80, firstEventYear: 2012, lastEventYear: 2017, canAdopt: true });
    // The same observations written out by hand (ages in days), through the estimator tested on the textbook data.
    const day = (from: string, to: string) => (Date.parse(to) - Date.parse(from)) / 86_400_000;
    const hand = [
      ...Array.from({ length: 36 }, (_, i) => ({ time: day('2010-03-01', `${2012 + (i % 6)}-03-01`), event: true })),
      ...Array.from({ length: 36 }, (_, i) => ({ time: day(`${2012 + (i % 6)}-03-01`, '2018-03-01'), event: false })),
      ...Array.from({ length: 4 }, () => ({ time: day('2015-03-01', '2016-03-01'), event: false })),
      ...Array.from({ length: 4 }, () => ({ time: day('2016-03-01', '2026-11-18'), event: false })),
    ];
    const steps = kaplanMeier(hand);
    expect(e.curve.map((p) => [p.atRisk, p.events])).toEqual(steps.map((s) => [s.atRisk, s.events]));
    e.curve.forEach((p, i) => expect(p.survival).toBeCloseTo(steps[i].survival, 4));
    expect(e.medianYears).toBeCloseTo(medianSurvival(steps)! / 365.25, 2);
  });

  it('lists one estimate per part type with history', async () => {
    const res = await fx.as.manager.get('/api/service-life').expect(200);
    const sensor = (res.body as ServiceLifeDto[]).find((e) => e.componentType === 'flame_sensor');
    expect(sensor).toMatchObject({ events: 3, canAdopt: false });
  });

  it('answers 401 signed out and 400 for an unstorable type', async () => {
    await fx.as.anonymous.get('/api/service-life').expect(401);
    const res = await fx.as.manager.get('/api/service-life').query({ type: 'x'.repeat(61) }).expect(400);
    expect(res.body.error.details.type).toBeDefined();
  });
});

describe('POST /due-rules/:id/adopt-learned-life', () => {
  const ruleFor = async (t: Tenant, type: string) =>
    (await ctx.db.select().from(dueRules).where(and(eq(dueRules.companyId, t.company.id), eq(dueRules.componentType, type))))[0];

  it('refuses a technician (403) and another company (404), writing nothing', async () => {
    const rule = await ruleFor(fx.t, 'thermocouple');
    await fx.as.technician.post(`/api/due-rules/${rule.id}/adopt-learned-life`).expect(403);
    const foreign = await ruleFor(other, 'thermocouple');
    await fx.as.manager.post(`/api/due-rules/${foreign.id}/adopt-learned-life`).expect(404);
    expect(await ruleFor(fx.t, 'thermocouple')).toEqual(rule);
    expect(await ruleFor(other, 'thermocouple')).toEqual(foreign);
  });

  it('refuses a part type with fewer than 30 events with a 400', async () => {
    const rule = await ruleFor(fx.t, 'flame_sensor');
    const res = await fx.as.manager.post(`/api/due-rules/${rule.id}/adopt-learned-life`).expect(400);
    expect(res.body.error.details._[0]).toMatch(/3 of 30/);
    expect(await ruleFor(fx.t, 'flame_sensor')).toEqual(rule);
  });

  it('adopts the learned median as a planning age, not a replacement date: stored rule, due items, stock forecast, audit', async () => {
    // Age is not a fault: a median describes the population (as ASHRAE's medians do; see PLANNING_MEDIAN_YEARS).
    // No inspection interval on the rule before, so adopting gives it the yearly inspection of the defaults.
    await ctx.db.update(dueRules).set({ inspectionIntervalMonths: null }).where(and(eq(dueRules.companyId, fx.t.company.id), eq(dueRules.componentType, 'thermocouple')));
    const rule = await ruleFor(fx.t, 'thermocouple');
    const estimate = await thermocouple(fx.as.manager);
    const res = await fx.as.manager.post(`/api/due-rules/${rule.id}/adopt-learned-life`).expect(200);
    const years = Math.round(estimate.medianYears!);
    expect(years).toBeGreaterThan(0);
    expect(res.body).toMatchObject({
      id: rule.id,
      basis: 'learned',
      replacementPolicy: 'on_condition',
      replacementAgeYears: null,
      planningAgeYears: years,
      inspectionIntervalMonths: 12,
    });
    expect(res.body.source).toMatch(/^Learned from 36 swaps, 2012–2017: Kaplan–Meier median .* planning age .*not a replacement date/);
    const stored = await ruleFor(fx.t, 'thermocouple');
    expect(stored).toMatchObject({ basis: 'learned', replacementPolicy: 'on_condition', replacementAgeYears: null, planningAgeYears: years, inspectionIntervalMonths: 12 });

    // The thermocouples in service fitted 2016-03-01 (an upgrade's fresh parts, never inspected) are due for
    // inspection a year after fitting, not for replacement at the median age.
    const present = await ctx.db
      .select()
      .from(components)
      .where(and(eq(components.companyId, fx.t.company.id), eq(components.typeCode, 'thermocouple'), eq(components.installedOn, '2016-03-01'), isNull(components.removedOn)));
    expect(present.length).toBe(4);
    for (const c of present) expect(c).toMatchObject({ dueOn: '2017-03-01', dueKind: 'inspection' });
    const due = await fx.as.manager.get('/api/due').query({ type: 'thermocouple', withinDays: 0 }).expect(200);
    const fresh = (due.body.items as { componentId: string; dueKind: string }[]).filter((i) => present.some((c) => c.id === i.componentId));
    expect(fresh.map((i) => i.dueKind)).toEqual(['inspection', 'inspection', 'inspection', 'inspection']);

    // The stock forecast lists them to plan for once they pass the learned median: 2016-03-01 + years.
    const stock = await fx.as.manager.get('/api/due/stock').query({ withinDays: 0 }).expect(200);
    const planned = (stock.body.pastMedianLife as { typeCode: string; count: number }[]).find((r) => r.typeCode === 'thermocouple');
    expect(2016 + years).toBeLessThanOrEqual(2026); // the estimate's median is 2–7 years
    expect(planned?.count).toBe(4);
    expect(stock.body.pastMedianLifeSource).toMatch(/learned from its own swaps/);

    const [audit] = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entityId, rule.id), eq(auditLog.action, 'adopt_learned_life')));
    expect(audit).toMatchObject({ companyId: fx.t.company.id, entity: 'due_rule', actorId: fx.t.manager.user.id });
  });

  it('keeps replacing by age only where the rule is on a published replacement interval', async () => {
    // A rule on a published interval (invented for the test) takes the learned median as its replacement age.
    await ctx.db
      .update(dueRules)
      .set({ replacementPolicy: 'fixed_age', replacementAgeYears: 3, planningAgeYears: null, inspectionIntervalMonths: null, basis: 'published', source: 'Demo publication: replace every 3 years' })
      .where(and(eq(dueRules.companyId, fx.t.company.id), eq(dueRules.componentType, 'thermocouple')));
    const rule = await ruleFor(fx.t, 'thermocouple');
    const years = Math.round((await thermocouple(fx.as.manager)).medianYears!);
    const res = await fx.as.manager.post(`/api/due-rules/${rule.id}/adopt-learned-life`).expect(200);
    expect(res.body).toMatchObject({ basis: 'learned', replacementPolicy: 'fixed_age', replacementAgeYears: years, planningAgeYears: null });
    expect(res.body.source).toMatch(/Replaces the 3-year replacement interval of: Demo publication/);
    expect(await ruleFor(fx.t, 'thermocouple')).toMatchObject({ replacementPolicy: 'fixed_age', replacementAgeYears: years, planningAgeYears: null });
    const present = await ctx.db
      .select()
      .from(components)
      .where(and(eq(components.companyId, fx.t.company.id), eq(components.typeCode, 'thermocouple'), eq(components.installedOn, '2016-03-01'), isNull(components.removedOn)));
    for (const c of present) expect(c).toMatchObject({ dueOn: `${2016 + years}-03-01`, dueKind: 'replacement' });
  });
});

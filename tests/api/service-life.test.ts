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

  it('sets the replacement age to the learned median, says where it came from, recomputes due dates and audits', async () => {
    // No inspection interval, so the replacement age alone sets the due dates checked below.
    await ctx.db.update(dueRules).set({ inspectionIntervalMonths: null }).where(and(eq(dueRules.companyId, fx.t.company.id), eq(dueRules.componentType, 'thermocouple')));
    const rule = await ruleFor(fx.t, 'thermocouple');
    const estimate = await thermocouple(fx.as.manager);
    const res = await fx.as.manager.post(`/api/due-rules/${rule.id}/adopt-learned-life`).expect(200);
    const years = Math.round(estimate.medianYears!);
    expect(res.body).toMatchObject({ id: rule.id, basis: 'learned', replacementPolicy: 'fixed_age', replacementAgeYears: years });
    expect(res.body.source).toMatch(/^Learned from 36 swaps, 2012–2017: Kaplan–Meier median/);
    const stored = await ruleFor(fx.t, 'thermocouple');
    expect(stored).toMatchObject({ basis: 'learned', replacementAgeYears: years, inspectionIntervalMonths: rule.inspectionIntervalMonths });

    // A thermocouple in service fitted 2016-03-01 (an upgrade's fresh part) is now due at that age.
    const present = await ctx.db
      .select()
      .from(components)
      .where(and(eq(components.companyId, fx.t.company.id), eq(components.typeCode, 'thermocouple'), eq(components.installedOn, '2016-03-01'), isNull(components.removedOn)));
    expect(present.length).toBe(4);
    for (const c of present) expect(c.dueOn).toBe(`${2016 + years}-03-01`);

    const [audit] = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entityId, rule.id), eq(auditLog.action, 'adopt_learned_life')));
    expect(audit).toMatchObject({ companyId: fx.t.company.id, entity: 'due_rule', actorId: fx.t.manager.user.id });
  });
});

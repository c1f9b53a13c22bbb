import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DbOrTx } from '../../server/db/client';
import { insertMember } from '../../server/db/factories/users';
import { appliances, auditLog, components, partSwaps, sites, timelineEvents, visitAmendments, visits } from '../../server/db/schema/index';
import { recomputeDueForAppliance } from '../../server/modules/due/due.repository';
import { todayInTimeZone } from '../../shared/dates';
import type { Fuel } from '../../shared/schemas/enums';
import { addDays, addMonths } from '../../shared/trade/index';
import { testApp } from '../support/context';
import { agentsFor, createTenant, signIn, type Agent, type Tenant } from '../support/tenant';
import { fullCompletion, GOOD_COMBUSTION } from '../support/visit-completion';
import { runFileAt } from '../support/clock';

const { app, ctx } = testApp();
// A Wednesday noon in the company's zone: "today" and every date worked out from it stay put while the file runs.
runFileAt('2026-11-18T12:00:00-05:00');
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherManager: Agent;
let tech2: Agent;
let tech2Id: string;
let today: string;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  otherManager = await signIn(app, other.manager.user.email);
  const second = await insertMember(ctx.db, { companyId: t.company.id, role: 'technician' });
  tech2 = await signIn(app, second.user.email);
  tech2Id = second.user.id;
  today = todayInTimeZone(t.company.timeZone);
});
afterAll(() => ctx.pool.end());

// ---- minimal local builders (the shared record factories belong to the records work) -------------------------------

/** A gas-fired steam boiler with a thermocouple, gauge glass, float low-water cutoff and burners. */
async function boiler(db: DbOrTx, tenant: Tenant, fuel: Fuel = 'natural_gas') {
  const [site] = await db
    .insert(sites)
    .values({ companyId: tenant.company.id, customerId: tenant.customer.id, street: '3 Quarry Lane', town: 'Wrenfield' })
    .returning();
  const [appliance] = await db
    .insert(appliances)
    .values({
      companyId: tenant.company.id,
      siteId: site.id,
      kind: 'steam_boiler',
      fuel,
      construction: 'cast_iron',
      ignitionType: fuel === 'oil_no2' ? 'oil_burner' : 'standing_pilot',
      ventType: fuel === 'oil_no2' ? 'barometric_damper' : 'draft_hood',
      installedOn: '2012-10-01',
    })
    .returning();
  const part = async (typeCode: string, values: Partial<typeof components.$inferInsert> = {}) =>
    (await db.insert(components).values({ companyId: tenant.company.id, applianceId: appliance.id, typeCode, ...values }).returning())[0];
  const parts = {
    thermocouple: await part('thermocouple', { spec: { lengthIn: 24 }, specKey: '24 in', installedOn: '2022-01-15', lastInspectedOn: '2025-10-01' }),
    gaugeGlass: await part('gauge_glass', { spec: { lengthIn: 12 }, specKey: '12 in', originalWithAppliance: true, lastInspectedOn: '2025-10-01' }),
    lowWaterCutoff: await part('low_water_cutoff_float', { originalWithAppliance: true }),
    burners: await part('burners', { originalWithAppliance: true }),
  };
  await recomputeDueForAppliance(db, tenant.company.id, appliance.id);
  return { site, appliance, parts };
}

async function storedVisit(id: string) {
  const [row] = await ctx.db.select().from(visits).where(eq(visits.id, id));
  return row;
}
async function storedComponent(id: string) {
  const [row] = await ctx.db.select().from(components).where(eq(components.id, id));
  return row;
}
async function start(agent: Agent, applianceId: string) {
  const res = await agent.post('/api/visits').send({ applianceId, type: 'annual_maintenance' });
  expect(res.status).toBe(200);
  return res.body;
}

const goodCombustion = GOOD_COMBUSTION;

describe('POST /api/visits: start a draft', () => {
  it('copies the checklist for the kind and fuel, and a retried tap returns the same draft', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const first = await start(as.technician, appliance.id);
    expect(first).toMatchObject({
      applianceId: appliance.id,
      status: 'draft',
      visitedOn: today,
      revision: 0,
      technicians: [{ id: t.technician.user.id, name: t.technician.user.name }],
      outcomeRequired: false,
    });
    const keys = first.checklist.map((i: { key: string }) => i.key);
    expect(keys).toEqual(expect.arrayContaining(['lwco_test', 'gauge_glass', 'pilot_thermocouple']));
    expect(first.checklist.every((i: { mark: unknown; note: string }) => i.mark === null && i.note === '')).toBe(true);

    const again = await start(as.technician, appliance.id);
    expect(again.id).toBe(first.id);
    const drafts = await ctx.db.select().from(visits).where(eq(visits.applianceId, appliance.id));
    expect(drafts).toHaveLength(1);
    expect(drafts[0]).toMatchObject({ status: 'draft', technicianIds: [t.technician.user.id], createdBy: t.technician.user.id });
    expect(drafts[0].arrivedAt).toBeInstanceOf(Date);

    // Two taps at once still make one draft.
    const fresh = await boiler(ctx.db, t);
    const [a, b] = await Promise.all([start(as.technician, fresh.appliance.id), start(as.technician, fresh.appliance.id)]);
    expect(a.id).toBe(b.id);
    expect(await ctx.db.select().from(visits).where(eq(visits.applianceId, fresh.appliance.id))).toHaveLength(1);

    // Another technician starts a draft of their own.
    const theirs = await start(tech2, appliance.id);
    expect(theirs.id).not.toBe(first.id);
  });

  it('a fuel-specific checklist wins over the one for every fuel', async () => {
    const { appliance } = await boiler(ctx.db, t, 'oil_no2');
    const visit = await start(as.technician, appliance.id);
    const keys = visit.checklist.map((i: { key: string }) => i.key);
    expect(keys).toContain('nozzle');
    expect(keys).not.toContain('pilot_thermocouple');
  });

  it('answers 404 for another tenant’s appliance, 400 for bad input, 403 for homeowners, 401 signed out', async () => {
    const { appliance } = await boiler(ctx.db, other);
    const foreign = await as.manager.post('/api/visits').send({ applianceId: appliance.id, type: 'repair' });
    expect(foreign.status).toBe(404);
    expect(await ctx.db.select().from(visits).where(eq(visits.applianceId, appliance.id))).toHaveLength(0);

    const bad = await as.technician.post('/api/visits').send({ applianceId: 'nope', type: 'party' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['applianceId', 'type']);

    const mine = await boiler(ctx.db, t);
    const future = await as.technician.post('/api/visits').send({ applianceId: mine.appliance.id, type: 'repair', visitedOn: addDays(today, 3) });
    expect(future.status).toBe(400);
    expect(future.body.error.details).toHaveProperty('visitedOn');

    expect((await as.homeowner.post('/api/visits').send({ applianceId: mine.appliance.id, type: 'repair' })).status).toBe(403);
    expect((await as.anonymous.post('/api/visits').send({ applianceId: mine.appliance.id, type: 'repair' })).status).toBe(401);
    expect(await ctx.db.select().from(visits).where(eq(visits.applianceId, mine.appliance.id))).toHaveLength(0);
  });
});

describe('PUT /api/visits/:id/draft', () => {
  it('saves, merges checklist marks by key and returns the server’s own results', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    const res = await as.technician.put(`/api/visits/${visit.id}/draft`).send({
      revision: 0,
      findings: 'Burners dusty.',
      checklist: [{ key: 'gauge_glass', mark: 'done', note: 'Cleaned.' }],
      readings: { combustion: goodCombustion, gaugeGlassLevel: '1/2' },
      // A client's own numbers are ignored: results are always computed on the server.
      results: { combustion: { coAirFreePpm: 1 } },
    });
    expect(res.status).toBe(200);
    expect(res.body.revision).toBe(1);
    // Method 19 correction: 50 × 20.9 / (20.9 − 7) = 75.18 ppm air-free.
    expect(res.body.results.combustion.coAirFreePpm).toBeCloseTo((50 * 20.9) / 13.9, 6);
    expect(res.body.results.gaugeGlass).toMatchObject({ fraction: 0.5, status: 'ok' });
    expect(res.body.readings.combustion).toEqual(goodCombustion);
    const item = res.body.checklist.find((i: { key: string }) => i.key === 'gauge_glass');
    expect(item).toMatchObject({ mark: 'done', note: 'Cleaned.', section: 'Gauge glass' });
    expect(res.body.checklist).toHaveLength(visit.checklist.length);

    const row = await storedVisit(visit.id);
    expect(row).toMatchObject({ revision: 1, findings: 'Burners dusty.', updatedBy: t.technician.user.id });
    expect((row.results as { combustion: { coAirFreePpm: number } }).combustion.coAirFreePpm).toBeCloseTo(75.18, 2);

    // A later save merges: fields not sent are kept.
    const second = await as.technician.put(`/api/visits/${visit.id}/draft`).send({ revision: 1, recommendations: 'Replace the gauge glass next year.' });
    expect(second.body).toMatchObject({ revision: 2, findings: 'Burners dusty.', recommendations: 'Replace the gauge glass next year.' });
    expect(second.body.readings.combustion).toEqual(goodCombustion);
  });

  it('refuses a stale revision with 409 and the current revision, keeping the stored row', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    await as.technician.put(`/api/visits/${visit.id}/draft`).send({ revision: 0, findings: 'First.' }).expect(200);
    const stale = await as.technician.put(`/api/visits/${visit.id}/draft`).send({ revision: 0, findings: 'Second, from a stale screen.' });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatchObject({ code: 'conflict', details: { currentRevision: 1 } });
    expect(await storedVisit(visit.id)).toMatchObject({ revision: 1, findings: 'First.' });
  });

  it('gives field errors for readings, unknown checklist keys and outside technicians, saving nothing', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    const put = (body: object) => as.technician.put(`/api/visits/${visit.id}/draft`).send({ revision: 0, ...body });

    const flue = await put({ readings: { combustion: { ...goodCombustion, flueTempF: 60 } } });
    expect(flue.status).toBe(400);
    expect(Object.keys(flue.body.error.details)).toEqual(['readings.combustion.flueTempF']);

    const o2 = await put({ readings: { combustion: { ...goodCombustion, o2Pct: 25 } } });
    expect(o2.status).toBe(400);
    expect(o2.body.error.details).toHaveProperty(['readings.combustion.o2Pct']);

    const glass = await put({ readings: { gaugeGlassLevel: 'plenty' } });
    expect(glass.status).toBe(400);
    expect(Object.keys(glass.body.error.details)).toEqual(['readings.gaugeGlassLevel']);

    const key = await put({ checklist: [{ key: 'no_such_item', mark: 'done', note: '' }] });
    expect(key.status).toBe(400);
    expect(Object.keys(key.body.error.details)).toEqual(['checklist.0.key']);

    const outsider = await put({ technicianIds: [other.technician.user.id] });
    expect(outsider.status).toBe(400);
    expect(outsider.body.error.details).toHaveProperty('technicianIds');

    const row = await storedVisit(visit.id);
    expect(row).toMatchObject({ revision: 0, readings: {}, technicianIds: [t.technician.user.id] });
  });

  it('answers 404 to another tenant and 403 to a homeowner', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    expect((await otherManager.put(`/api/visits/${visit.id}/draft`).send({ revision: 0, findings: 'x' })).status).toBe(404);
    expect((await otherManager.get(`/api/visits/${visit.id}`)).status).toBe(404);
    expect((await as.homeowner.put(`/api/visits/${visit.id}/draft`).send({ revision: 0, findings: 'x' })).status).toBe(403);
    expect((await as.homeowner.get(`/api/visits/${visit.id}`)).status).toBe(403);
    expect(await storedVisit(visit.id)).toMatchObject({ revision: 0, findings: '' });
  });
});

describe('POST /api/visits/:id/complete', () => {
  it('a step marked "needs attention" without a note leaves a note on the part that says the visit\'s date in words', async () => {
    const { appliance, parts } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    const res = await as.technician.post(`/api/visits/${visit.id}/complete`).send(
      fullCompletion(visit, {
        checklist: [{ key: 'gauge_glass', mark: 'needs_attention', note: '' }],
        readings: { combustion: goodCombustion, lowWaterCutoff: { type: 'float', trippedWith: 'water_visible', burnerStopped: true } },
        outcome: 'left_operating',
      }),
    );
    expect(res.status).toBe(200);
    const glass = await storedComponent(parts.gaugeGlass.id);
    expect(glass.conditionFailed).toBe(true);
    expect(glass.conditionNote).toMatch(/: needs attention \(visit of [A-Z][a-z]{2} \d{1,2}, \d{4}\)\.$/);
    expect(glass.conditionNote).not.toMatch(/\d{4}-\d{2}-\d{2}/);
  });

  it('signs off and writes parts, due dates, timeline and audit together', async () => {
    const { appliance, parts } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    const res = await as.technician.post(`/api/visits/${visit.id}/complete`).send(
      fullCompletion(visit, {
        checklist: [{ key: 'gauge_glass', mark: 'needs_attention', note: 'Glass etched, hard to read.' }],
        readings: { combustion: goodCombustion, thermocouple: { openCircuitMv: 12 }, lowWaterCutoff: { type: 'float', trippedWith: 'water_visible', burnerStopped: true } },
        outcome: 'left_operating',
        // The weak thermocouple raises a warning (from memory: replace below about 18 mV), so who was told is required.
        outcomeReason: 'Thermocouple weak; replacement booked.',
        outcomeToldWhom: 'Homeowner',
      }),
    );
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'completed', outcome: 'left_operating', signedOffBy: { id: t.technician.user.id } });
    expect(res.body.completedAt).not.toBeNull();
    expect(res.body.departedAt).not.toBeNull();

    const row = await storedVisit(visit.id);
    expect(row).toMatchObject({ status: 'completed', signedOffBy: t.technician.user.id, revision: 1 });

    const glass = await storedComponent(parts.gaugeGlass.id);
    expect(glass).toMatchObject({ conditionFailed: true, conditionNote: 'Glass etched, hard to read.', lastInspectedOn: today, dueOn: today, dueKind: 'replacement' });
    // 12 mV open circuit is below the replacement point: the thermocouple is due for replacement now.
    const thermocouple = await storedComponent(parts.thermocouple.id);
    expect(thermocouple).toMatchObject({ conditionFailed: true, lastInspectedOn: today, dueOn: today, dueKind: 'replacement' });
    expect(thermocouple.conditionNote).toMatch(/replace the thermocouple/);
    const cutoff = await storedComponent(parts.lowWaterCutoff.id);
    expect(cutoff).toMatchObject({ conditionFailed: false, lastInspectedOn: today, dueOn: addMonths(today, 12), dueKind: 'inspection' });

    const events = await ctx.db.select().from(timelineEvents).where(eq(timelineEvents.applianceId, appliance.id));
    const visitEvent = events.find((e) => e.kind === 'visit')!;
    expect(visitEvent).toMatchObject({ refId: visit.id, actorId: t.technician.user.id });
    expect(visitEvent.summary).toMatch(/^Annual maintenance: left operating\./);
    const reading = events.find((e) => e.kind === 'reading')!;
    expect(reading.data).toMatchObject({ visitId: visit.id, coAirFreePpm: 75, flueTempF: 400, thermocoupleOpenCircuitMv: 12 });
    expect(typeof reading.data.efficiencyPct).toBe('number');
    const audits = await ctx.db.select().from(auditLog).where(eq(auditLog.entityId, visit.id));
    expect(audits.map((a) => a.action).sort()).toEqual(['complete', 'start', 'visit_report_mailed']);
  });

  it('a completed visit cannot be edited in place (409, stored row unchanged)', async () => {
    const { appliance, parts } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    await as.technician.post(`/api/visits/${visit.id}/complete`).send(fullCompletion(visit, { findings: 'All good.' })).expect(200);
    const before = await storedVisit(visit.id);

    const edit = await as.technician.put(`/api/visits/${visit.id}/draft`).send({ revision: before.revision, findings: 'Changed my mind.' });
    expect(edit.status).toBe(409);
    expect(edit.body.error.message).toBe('A completed visit is amended, not edited.');
    const again = await as.technician.post(`/api/visits/${visit.id}/complete`).send({ revision: before.revision, findings: 'Again.' });
    expect(again.status).toBe(409);
    const swap = await as.technician.post(`/api/visits/${visit.id}/swaps`).send({ componentId: parts.thermocouple.id });
    expect(swap.status).toBe(409);
    expect(await storedVisit(visit.id)).toEqual(before);
    expect((await storedComponent(parts.thermocouple.id)).removedOn).toBeNull();
  });

  it('a failed low-water cutoff test needs an outcome; "shut down as unsafe" needs why and who was told', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    const failedCutoff = { type: 'float', trippedAtLevel: '1/4', burnerStopped: false } as const;
    const saved = await as.technician.put(`/api/visits/${visit.id}/draft`).send({ revision: 0, readings: { lowWaterCutoff: failedCutoff } });
    expect(saved.body.outcomeRequired).toBe(true);
    expect(saved.body.results.flags.map((f: { code: string }) => f.code)).toContain('low_water_cutoff_failed');
    // Everything else is in order: only the outcome and what the occupant was told are missing.
    const rest = { ...fullCompletion(saved.body, { readings: { lowWaterCutoff: failedCutoff } }), outcome: null };

    const noOutcome = await as.technician.post(`/api/visits/${visit.id}/complete`).send(rest);
    expect(noOutcome.status).toBe(400);
    expect(Object.keys(noOutcome.body.error.details)).toEqual(['outcome', 'outcomeReason', 'outcomeToldWhom']);
    expect(await storedVisit(visit.id)).toMatchObject({ status: 'draft', revision: 1, completedAt: null });

    const unexplained = await as.technician.post(`/api/visits/${visit.id}/complete`).send({ ...rest, outcome: 'shut_down_unsafe' });
    expect(unexplained.status).toBe(400);
    expect(Object.keys(unexplained.body.error.details).sort()).toEqual(['outcomeReason', 'outcomeToldWhom']);
    expect(unexplained.body.error.details.outcomeReason).toEqual(['Say why the appliance was shut down.']);
    expect(await storedVisit(visit.id)).toMatchObject({ status: 'draft', outcome: null });

    const done = await as.technician.post(`/api/visits/${visit.id}/complete`).send({
      ...rest,
      outcome: 'shut_down_unsafe',
      outcomeReason: 'Low-water cutoff did not stop the burner.',
      outcomeToldWhom: 'Occupant',
    });
    expect(done.status).toBe(200);
    expect(await storedVisit(visit.id)).toMatchObject({ status: 'completed', outcome: 'shut_down_unsafe', outcomeToldWhom: 'Occupant' });
    const [event] = await ctx.db
      .select()
      .from(timelineEvents)
      .where(and(eq(timelineEvents.applianceId, appliance.id), eq(timelineEvents.kind, 'visit')));
    expect(event.summary).toContain('shut down as unsafe');
  });
});

describe('POST /api/visits/:id/complete: what a completion must hold', () => {
  const complete = (visitId: string, body: object) => as.technician.post(`/api/visits/${visitId}/complete`).send(body);
  const fieldsOf = (res: { body: { error: { details: Record<string, string[]> } } }) => Object.keys(res.body.error.details);

  /** Nothing of a refused completion is kept: still a draft at its revision, no due date moved, no timeline event. */
  async function expectNothingWritten(visitId: string, applianceId: string, revision: number) {
    expect(await storedVisit(visitId)).toMatchObject({ status: 'draft', revision, completedAt: null, signedOffBy: null });
    expect(await ctx.db.select().from(timelineEvents).where(eq(timelineEvents.applianceId, applianceId))).toHaveLength(0);
  }

  it('the annual visit of a gas steam boiler starts with the combustion and low-water cutoff tests required', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    expect(visit).toMatchObject({ requiredReadings: ['combustion', 'lowWaterCutoff'], readingSkips: {} });
    expect((await storedVisit(visit.id)).requiredReadings).toEqual(['combustion', 'lowWaterCutoff']);
    const repair = await as.technician.post('/api/visits').send({ applianceId: (await boiler(ctx.db, t)).appliance.id, type: 'repair' });
    expect(repair.body.requiredReadings).toEqual([]);
  });

  it('refuses an empty visit with each missing thing by field, and writes nothing', async () => {
    const { appliance, parts } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    const before = await storedComponent(parts.lowWaterCutoff.id);
    const res = await complete(visit.id, { revision: 0 });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.message).toBe(`Not completed yet: ${visit.checklist.length + 3} things are missing.`);
    expect(fieldsOf(res)).toEqual([
      ...visit.checklist.map((i: { key: string }) => `checklist.${i.key}`),
      'readings.combustion',
      'readings.lowWaterCutoff',
      'outcome',
    ]);
    expect(res.body.error.details['checklist.lwco_test'][0]).toMatch(/^“Test the low-water cutoff for its type”: Mark this step/);
    expect(res.body.error.details['readings.combustion']).toEqual(['Required on annual maintenance: take it, or mark it not taken and say why.']);
    await expectNothingWritten(visit.id, appliance.id, 0);
    expect(await storedComponent(parts.lowWaterCutoff.id)).toEqual(before);
  });

  it('needs an outcome even when nothing is wrong', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    const res = await complete(visit.id, fullCompletion(visit, { outcome: null }));
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual({ outcome: ['Choose the outcome: left operating or shut down as unsafe.'] });
    await expectNothingWritten(visit.id, appliance.id, 0);
  });

  it('needs every checklist step marked (done, not applicable or needs attention)', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    const res = await complete(visit.id, fullCompletion(visit, { checklist: [{ key: 'gauge_glass', mark: null, note: '' }] }));
    expect(res.status).toBe(400);
    expect(fieldsOf(res)).toEqual(['checklist.gauge_glass']);
    await expectNothingWritten(visit.id, appliance.id, 0);

    const marked = await complete(visit.id, fullCompletion(visit, { checklist: [{ key: 'gauge_glass', mark: 'not_applicable', note: 'No glass fitted.' }] }));
    expect(marked.status).toBe(200);
  });

  it('needs the required readings, or each skipped with a reason that is then kept with the visit', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    const body = fullCompletion(visit);
    const missing = await complete(visit.id, { ...body, readings: { lowWaterCutoff: body.readings!.lowWaterCutoff } });
    expect(missing.status).toBe(400);
    expect(fieldsOf(missing)).toEqual(['readings.combustion']);

    const noReason = await complete(visit.id, { ...body, readings: { lowWaterCutoff: body.readings!.lowWaterCutoff }, readingSkips: { combustion: '   ' } });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.details).toEqual({ 'readingSkips.combustion': ['Say why the combustion test was not taken.'] });
    await expectNothingWritten(visit.id, appliance.id, 0);

    const unknownSkip = await complete(visit.id, { ...body, readingSkips: { moonPhase: 'x' } });
    expect(unknownSkip.status).toBe(400);
    expect(fieldsOf(unknownSkip)).toEqual(['readingSkips']);

    const skipped = await complete(visit.id, { ...body, readings: { lowWaterCutoff: body.readings!.lowWaterCutoff }, readingSkips: { combustion: 'Analyzer in repair.' } });
    expect(skipped.status).toBe(200);
    expect(skipped.body).toMatchObject({ status: 'completed', readingSkips: { combustion: 'Analyzer in repair.' } });
    expect(await storedVisit(visit.id)).toMatchObject({ status: 'completed', readingSkips: { combustion: 'Analyzer in repair.' } });
    expect((await storedVisit(visit.id)).readings).not.toHaveProperty('combustion');
  });

  it('an electric boiler has no combustion test to take; its other required readings still count', async () => {
    const { appliance } = await boiler(ctx.db, t);
    await ctx.db.update(appliances).set({ construction: 'electric' }).where(eq(appliances.id, appliance.id));
    const visit = await start(as.technician, appliance.id);
    const body = fullCompletion(visit);
    const noCutoff = await complete(visit.id, { ...body, readings: {} });
    expect(fieldsOf(noCutoff)).toEqual(['readings.lowWaterCutoff']);
    const done = await complete(visit.id, { ...body, readings: { lowWaterCutoff: body.readings!.lowWaterCutoff } });
    expect(done.status).toBe(200);
  });

  it('refuses readings in error with field errors instead of dropping them', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    // What the phone had on screen: O2 25 % and "abc" in the CO field.
    const res = await complete(visit.id, fullCompletion(visit, { readings: { combustion: { ...goodCombustion, o2Pct: 25, coPpm: 'abc' as unknown as number } } }));
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual({
      'readings.combustion.o2Pct': ['O2 must be at least 0 and below 20.9 % (the analyzer O2 range; 20.9 % is air).'],
      'readings.combustion.coPpm': ['CO must be a number.'],
    });
    await expectNothingWritten(visit.id, appliance.id, 0);
    expect((await storedVisit(visit.id)).readings).toEqual({});
  });

  it('refuses a flue temperature below the combustion-air temperature as impossible', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    // common practice: at steady firing the flue gas is heated by the fire, so it cannot be colder than the air it came from.
    const res = await complete(visit.id, fullCompletion(visit, { readings: { combustion: { ...goodCombustion, flueTempF: 65, airTempF: 70 } } }));
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual({
      'readings.combustion.flueTempF': [
        'Flue temperature 65 °F is below the combustion-air temperature 70 °F: impossible at steady firing. Check the probe is in the flue and read again.',
      ],
    });
    await expectNothingWritten(visit.id, appliance.id, 0);
  });

  it('refuses a flue temperature outside −40…1,200 °F, naming the range', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    // common practice: residential boiler flue gas runs roughly 250–600 °F; over 1,200 °F the probe is in the flame.
    const range = 'Flue temperature must be between −40 and 1,200 °F (−40 and 649 °C).';
    for (const flueTempF of [1201, -41]) {
      const res = await complete(visit.id, fullCompletion(visit, { readings: { combustion: { ...goodCombustion, flueTempF, airTempF: -40 } } }));
      expect(res.status).toBe(400);
      expect(res.body.error.details).toEqual({ 'readings.combustion.flueTempF': [range] });
    }
    await expectNothingWritten(visit.id, appliance.id, 0);
    const edge = await complete(visit.id, fullCompletion(visit, { readings: { combustion: { ...goodCombustion, flueTempF: 1200 } } }));
    expect(edge.status).toBe(200);
  });

  it('a warning flag (flue CO 120 ppm) needs the outcome, who was told and what they were told', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    // Source: BPI-1200 flue-CO bands as coded in shared/trade/combustion-flags.ts: over 100 ppm as measured is "service required", a warning.
    const highCo = { combustion: { ...goodCombustion, coPpm: 120 } };
    const saved = await as.technician.put(`/api/visits/${visit.id}/draft`).send({ revision: 0, readings: highCo });
    expect(saved.body.results.flags).toEqual(expect.arrayContaining([expect.objectContaining({ code: 'flue_co_service_required', severity: 'warning' })]));

    const untold = await complete(visit.id, fullCompletion(saved.body, { readings: highCo, outcome: null }));
    expect(untold.status).toBe(400);
    expect(untold.body.error.details).toEqual({
      outcome: ['Choose the outcome: a warning or stop is recorded on this visit, so say whether the appliance was left operating or shut down as unsafe.'],
      outcomeReason: ['Say what the occupant was told about the warning.'],
      outcomeToldWhom: ['Say who was told about the warning.'],
    });
    const leftUntold = await complete(visit.id, fullCompletion(saved.body, { readings: highCo, outcome: 'left_operating' }));
    expect(fieldsOf(leftUntold)).toEqual(['outcomeReason', 'outcomeToldWhom']);
    await expectNothingWritten(visit.id, appliance.id, 1);

    const toldAt = '2025-11-03T15:20:00.000Z';
    const told = await complete(
      visit.id,
      fullCompletion(saved.body, {
        readings: highCo,
        outcome: 'left_operating',
        outcomeReason: 'Flue CO is high: burners need cleaning and the air set; booked for next week. Told to keep the CO alarm on.',
        outcomeToldWhom: 'Homeowner, in person',
        outcomeToldAt: toldAt,
      }),
    );
    expect(told.status).toBe(200);
    const row = await storedVisit(visit.id);
    expect(row).toMatchObject({ status: 'completed', outcome: 'left_operating', outcomeToldWhom: 'Homeowner, in person', revision: 2 });
    expect(row.outcomeToldAt?.toISOString()).toBe(toldAt);
    expect(row.outcomeReason).toMatch(/^Flue CO is high/);
  });

  it('a complete, valid visit is signed off with every step marked, its readings, and the due date moved on', async () => {
    const { appliance, parts } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    const res = await complete(visit.id, fullCompletion(visit, { findings: 'All in order.' }));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'completed', outcome: 'left_operating', requiredReadings: ['combustion', 'lowWaterCutoff'], readingSkips: {} });
    const row = await storedVisit(visit.id);
    expect(row).toMatchObject({ status: 'completed', outcome: 'left_operating', findings: 'All in order.', signedOffBy: t.technician.user.id, revision: 1 });
    expect(row.checklist).toHaveLength(visit.checklist.length);
    expect(row.checklist.every((i) => i.mark === 'done')).toBe(true);
    expect(row.readings).toEqual({ combustion: goodCombustion, lowWaterCutoff: { type: 'float', trippedAtLevel: '1/4', trippedWith: 'water_visible', burnerStopped: true } });
    expect(row.completedAt).toBeInstanceOf(Date);
    expect(await storedComponent(parts.lowWaterCutoff.id)).toMatchObject({ lastInspectedOn: today, dueOn: addMonths(today, 12) });
  });
});

describe('POST /api/visits/:id/swaps', () => {
  it('removes the old part, installs the new one the same day, and records the swap with its timeline event', async () => {
    const { appliance, parts } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    const swappedOn = addDays(today, -1);
    const res = await as.technician
      .post(`/api/visits/${visit.id}/swaps`)
      .send({ componentId: parts.thermocouple.id, reason: 'Weak output', newSpec: { lengthIn: 30 }, newDescription: 'thermocouple, 30 in', swappedOn });
    expect(res.status).toBe(200);
    expect(res.body.swaps).toHaveLength(1);
    const swap = res.body.swaps[0];
    expect(swap).toMatchObject({ removedComponentId: parts.thermocouple.id, typeLabel: 'thermocouple', swappedOn, reason: 'Weak output', newDescription: 'thermocouple, 30 in' });

    const old = await storedComponent(parts.thermocouple.id);
    expect(old).toMatchObject({ removedOn: swappedOn, removalReason: 'Weak output', replacedById: swap.newComponentId, dueOn: null });
    const fresh = await storedComponent(swap.newComponentId);
    expect(fresh).toMatchObject({ applianceId: appliance.id, typeCode: 'thermocouple', installedOn: swappedOn, spec: { lengthIn: 30 }, specKey: '30 in', removedOn: null });
    expect(fresh).toMatchObject({ dueKind: 'inspection', dueOn: addMonths(swappedOn, 12) });
    const [row] = await ctx.db.select().from(partSwaps).where(eq(partSwaps.id, swap.id));
    expect(row).toMatchObject({ visitId: visit.id, swappedOn, newComponentId: fresh.id });
    const events = await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.refId, swap.id), eq(timelineEvents.kind, 'part_swap')));
    expect(events).toHaveLength(1);
    expect(events[0].summary).toBe('Replaced the thermocouple (30 in): Weak output.');
    expect(await ctx.db.select().from(auditLog).where(eq(auditLog.entityId, swap.id))).toHaveLength(1);

    // The visit's summary names what was replaced once it is completed; the weak reading was the old part's.
    await as.technician.post(`/api/visits/${visit.id}/complete`).send(fullCompletion(visit, { readings: { thermocouple: { openCircuitMv: 12 } }, outcomeReason: 'Old thermocouple was weak; replaced.', outcomeToldWhom: 'Homeowner' })).expect(200);
    expect(await storedComponent(fresh.id)).toMatchObject({ conditionFailed: false, lastInspectedOn: today, removedOn: null });
    const [visitEvent] = await ctx.db
      .select()
      .from(timelineEvents)
      .where(and(eq(timelineEvents.refId, visit.id), eq(timelineEvents.kind, 'visit')));
    expect(visitEvent.summary).toContain('Replaced: thermocouple (30 in).');
  });

  it('404 for another tenant’s part, 400 for a part of another appliance or a bad spec, writing nothing', async () => {
    const { appliance, parts } = await boiler(ctx.db, t);
    const elsewhere = await boiler(ctx.db, t);
    const foreign = await boiler(ctx.db, other);
    const visit = await start(as.technician, appliance.id);
    const swap = (body: object) => as.technician.post(`/api/visits/${visit.id}/swaps`).send(body);

    expect((await swap({ componentId: foreign.parts.thermocouple.id })).status).toBe(404);
    const wrongAppliance = await swap({ componentId: elsewhere.parts.thermocouple.id });
    expect(wrongAppliance.status).toBe(400);
    expect(Object.keys(wrongAppliance.body.error.details)).toEqual(['componentId']);
    const badSpec = await swap({ componentId: parts.thermocouple.id, newSpec: { colour: 'blue' } });
    expect(badSpec.status).toBe(400);
    expect(Object.keys(badSpec.body.error.details)).toEqual(['newSpec.colour']);
    const future = await swap({ componentId: parts.thermocouple.id, swappedOn: addDays(today, 2) });
    expect(future.status).toBe(400);

    expect(await ctx.db.select().from(partSwaps).where(eq(partSwaps.visitId, visit.id))).toHaveLength(0);
    for (const id of [parts.thermocouple.id, elsewhere.parts.thermocouple.id, foreign.parts.thermocouple.id]) {
      expect((await storedComponent(id)).removedOn).toBeNull();
    }
    const present = await ctx.db.select().from(components).where(eq(components.applianceId, appliance.id));
    expect(present).toHaveLength(4);
    expect(await ctx.db.select().from(timelineEvents).where(eq(timelineEvents.applianceId, appliance.id))).toHaveLength(0);
  });
});

describe('POST /api/visits/:id/amendments', () => {
  let visitId: string;
  let swapId: string;
  let oldPartId: string;
  let newPartId: string;

  beforeAll(async () => {
    const { appliance, parts } = await boiler(ctx.db, t);
    const visit = await start(as.technician, appliance.id);
    const swapped = await as.technician.post(`/api/visits/${visit.id}/swaps`).send({ componentId: parts.thermocouple.id, swappedOn: today });
    swapId = swapped.body.swaps[0].id;
    oldPartId = parts.thermocouple.id;
    newPartId = swapped.body.swaps[0].newComponentId;
    // Required readings skipped with a reason, so the visit's own readings stay empty for the checks below.
    await as.technician
      .post(`/api/visits/${visit.id}/complete`)
      .send(
        fullCompletion(
          visit,
          // The new thermocouple is not inspected on this visit, so its due date follows its install date alone.
          { findings: 'Original findings.', checklist: [{ key: 'pilot_thermocouple', mark: 'not_applicable', note: 'Pilot checked on the earlier call.' }] },
          { skipRequiredWith: 'Analyzer away for calibration.' },
        ),
      )
      .expect(200);
    visitId = visit.id;
  });

  it('lets a manager correct any visit; the original and the amendment are both returned', async () => {
    const res = await as.manager.post(`/api/visits/${visitId}/amendments`).send({ reason: 'Typo in the findings.', findings: 'Corrected findings.' });
    expect(res.status).toBe(200);
    expect(res.body.findings).toBe('Original findings.');
    const last = res.body.amendments.at(-1);
    expect(last).toMatchObject({ reason: 'Typo in the findings.', changes: { findings: 'Corrected findings.' }, createdByName: t.manager.user.name });
    expect((await storedVisit(visitId)).findings).toBe('Original findings.');
    const rows = await ctx.db.select().from(visitAmendments).where(eq(visitAmendments.visitId, visitId));
    expect(rows.some((r) => r.createdBy === t.manager.user.id && r.changes.findings === 'Corrected findings.')).toBe(true);
    const events = await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.refId, visitId), eq(timelineEvents.kind, 'amendment')));
    expect(events.length).toBeGreaterThanOrEqual(1);
  });

  it('lets the visit’s own technician correct it, refuses another technician (403) and a homeowner (403)', async () => {
    const own = await as.technician.post(`/api/visits/${visitId}/amendments`).send({ reason: 'Forgot a recommendation.', recommendations: 'Skim the boiler.' });
    expect(own.status).toBe(200);
    expect(own.body.amendments.at(-1)).toMatchObject({ createdByName: t.technician.user.name, changes: { recommendations: 'Skim the boiler.' } });
    const count = (await ctx.db.select().from(visitAmendments).where(eq(visitAmendments.visitId, visitId))).length;

    expect((await tech2.post(`/api/visits/${visitId}/amendments`).send({ reason: 'Not my visit.', findings: 'x' })).status).toBe(403);
    expect((await as.homeowner.post(`/api/visits/${visitId}/amendments`).send({ reason: 'Mine.', findings: 'x' })).status).toBe(403);
    expect((await otherManager.post(`/api/visits/${visitId}/amendments`).send({ reason: 'Other firm.', findings: 'x' })).status).toBe(404);
    expect((await as.manager.post(`/api/visits/${visitId}/amendments`).send({ reason: '' })).status).toBe(400);
    expect(await ctx.db.select().from(visitAmendments).where(eq(visitAmendments.visitId, visitId))).toHaveLength(count);
    expect(tech2Id).not.toBe(t.technician.user.id);
  });

  it('checks corrected readings and outcomes like a sign-off, storing the server’s results beside them', async () => {
    const badReading = await as.manager
      .post(`/api/visits/${visitId}/amendments`)
      .send({ reason: 'Readings were mistyped.', readings: { combustion: { ...goodCombustion, flueTempF: 50 } } });
    expect(badReading.status).toBe(400);
    expect(Object.keys(badReading.body.error.details)).toEqual(['readings.combustion.flueTempF']);
    const badOutcome = await as.manager.post(`/api/visits/${visitId}/amendments`).send({ reason: 'It was unsafe.', outcome: { outcome: 'shut_down_unsafe' } });
    expect(badOutcome.status).toBe(400);
    expect(Object.keys(badOutcome.body.error.details).sort()).toEqual(['outcome.outcomeReason', 'outcome.outcomeToldWhom']);

    const res = await as.manager.post(`/api/visits/${visitId}/amendments`).send({ reason: 'Readings were mistyped.', readings: { combustion: goodCombustion } });
    expect(res.status).toBe(200);
    const changes = res.body.amendments.at(-1).changes;
    expect(changes.readings).toEqual({ combustion: goodCombustion });
    expect(changes.results.combustion.coAirFreePpm).toBeCloseTo(75.18, 2);
    expect(res.body.readings).toEqual({});
  });

  it('refuses to amend a draft (409)', async () => {
    const { appliance } = await boiler(ctx.db, t);
    const draft = await start(as.technician, appliance.id);
    const res = await as.manager.post(`/api/visits/${draft.id}/amendments`).send({ reason: 'Too early.', findings: 'x' });
    expect(res.status).toBe(409);
    expect(await ctx.db.select().from(visitAmendments).where(eq(visitAmendments.visitId, draft.id))).toHaveLength(0);
  });

  it('a corrected swap date moves the part-swap row and both parts’ dates, and the due date follows', async () => {
    const corrected = addDays(today, -20);
    const bad = await as.manager.post(`/api/visits/${visitId}/amendments`).send({ reason: 'Wrong swap.', swaps: [{ swapId: oldPartId, swappedOn: corrected }] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details)).toEqual(['swaps.0.swapId']);

    const res = await as.manager
      .post(`/api/visits/${visitId}/amendments`)
      .send({ reason: 'The thermocouple was fitted on the earlier call.', swaps: [{ swapId, swappedOn: corrected }] });
    expect(res.status).toBe(200);
    expect(res.body.swaps[0].swappedOn).toBe(corrected);
    expect(res.body.amendments.at(-1).changes.swaps).toEqual([{ swapId, swappedOn: corrected, previousSwappedOn: today, reason: null }]);
    const [swapRow] = await ctx.db.select().from(partSwaps).where(eq(partSwaps.id, swapId));
    expect(swapRow.swappedOn).toBe(corrected);
    expect((await storedComponent(oldPartId)).removedOn).toBe(corrected);
    expect(await storedComponent(newPartId)).toMatchObject({ installedOn: corrected, dueOn: addMonths(corrected, 12), dueKind: 'inspection' });
  });

  it('GET returns the visit with technician names, swaps and amendments oldest first', async () => {
    const res = await as.technician.get(`/api/visits/${visitId}`);
    expect(res.status).toBe(200);
    expect(res.body.technicians).toEqual([{ id: t.technician.user.id, name: t.technician.user.name }]);
    const times = res.body.amendments.map((a: { createdAt: string }) => a.createdAt);
    expect(times).toEqual([...times].sort());
    expect(res.body.amendments.length).toBeGreaterThanOrEqual(4);
    expect((await as.anonymous.get(`/api/visits/${visitId}`)).status).toBe(401);
  });
});

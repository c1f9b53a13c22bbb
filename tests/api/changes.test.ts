import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { insertSite } from '../../server/db/factories/records';
import { auditLog } from '../../server/db/schema/index';
import type { ChangeDto, ChangesPageDto } from '../../shared/schemas/changes';
import type { VisitDto } from '../../shared/schemas/visits';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';
import { fullCompletion, GOOD_COMBUSTION } from '../support/visit-completion';
import { runFileAt } from '../support/clock';

const { app, ctx } = testApp();
runFileAt('2026-11-18T12:00:00-05:00');

let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherAs: Awaited<ReturnType<typeof agentsFor>>;
let applianceId: string;
let visitId: string;
const CO_REASON = 'The analyzer was re-read at the office: the CO was written down wrong.';
const OUTCOME_REASON = 'Review of the photos: the heat exchanger is cracked.';

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  [as, otherAs] = await Promise.all([agentsFor(app, t), agentsFor(app, other)]);
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
  const created = await as.manager.post('/api/appliances').send({
    siteId: site.id,
    kind: 'hot_water_boiler',
    fuel: 'natural_gas',
    construction: 'cast_iron',
    ignitionType: 'standing_pilot',
    ventType: 'draft_hood',
    inputBtuh: 105000,
    components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 }, originalWithAppliance: true }],
  });
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  applianceId = created.body.appliance.id;
  await as.technician.patch(`/api/appliances/${applianceId}`).send({ location: 'Cellar, north wall' }).expect(200);
  const started = await as.technician.post('/api/visits').send({ applianceId, type: 'annual_maintenance' }).expect(200);
  const visit = started.body as VisitDto;
  visitId = visit.id;
  const done = await as.technician
    .post(`/api/visits/${visitId}/complete`)
    .send(fullCompletion(visit, { readings: { combustion: GOOD_COMBUSTION }, findings: 'Cleaned the burners.' }, { skipRequiredWith: 'Not asked on this visit.' }));
  expect(done.status, JSON.stringify(done.body)).toBe(200);
  const co = await as.manager.post(`/api/visits/${visitId}/amendments`).send({ reason: CO_REASON, readings: { combustion: { ...GOOD_COMBUSTION, coPpm: 120 } } });
  expect(co.status, JSON.stringify(co.body)).toBe(200);
  const outcome = await as.manager.post(`/api/visits/${visitId}/amendments`).send({
    reason: OUTCOME_REASON,
    outcome: { outcome: 'shut_down_unsafe', outcomeReason: 'Cracked heat exchanger.', outcomeToldWhom: 'The homeowner, in person', outcomeToldAt: new Date().toISOString() },
  });
  expect(outcome.status, JSON.stringify(outcome.body)).toBe(200);
});
afterAll(() => ctx.pool.end());

const visitUrl = (id: string) => `/api/visits/${id}/changes`;
const recordUrl = (id: string) => `/api/appliances/${id}/changes`;

async function allPages(url: string, limit: number) {
  const items: ChangeDto[] = [];
  let cursor: string | null = null;
  for (let i = 0; i < 50; i += 1) {
    const res = await as.manager.get(url).query(cursor ? { limit, cursor } : { limit });
    expect(res.status).toBe(200);
    const page = res.body as ChangesPageDto;
    expect(page.items.length).toBeLessThanOrEqual(limit);
    items.push(...page.items);
    cursor = page.nextCursor;
    if (!cursor) return items;
  }
  throw new Error('more pages than expected');
}

describe('GET /api/visits/:id/changes', () => {
  it('tells each change in words, newest first, with who, when and why; each entry is a stored audit row', async () => {
    const res = await as.manager.get(visitUrl(visitId));
    expect(res.status).toBe(200);
    const { items, nextCursor } = res.body as ChangesPageDto;
    expect(nextCursor).toBeNull();
    const whats = items.map((i) => i.what);
    expect(whats[0]).toBe('Amended the outcome');
    expect(whats[1]).toBe('Amended the CO reading');
    expect(whats).toContain('Completed the visit');
    expect(whats.at(-1)).toBe('Started a visit (annual maintenance)');
    // Newest first.
    const ats = items.map((i) => Date.parse(i.at));
    expect([...ats].sort((a, b) => b - a)).toEqual(ats);

    const [outcome, co] = items;
    expect(outcome).toMatchObject({ who: t.manager.user.name, why: OUTCOME_REASON });
    expect(outcome.details).toContain('Changed the outcome from left operating to shut down as unsafe.');
    expect(co).toMatchObject({ who: t.manager.user.name, why: CO_REASON, details: ['Changed the CO reading from 50 ppm to 120 ppm.'] });
    // The fixed clock's day in the company's zone (New York).
    for (const i of items) expect(i.visit).toEqual({ id: visitId, visitedOn: '2026-11-18' });
    const completed = items.find((i) => i.what === 'Completed the visit')!;
    expect(completed).toMatchObject({ who: t.technician.user.name, details: ['Outcome: left operating.'], why: null });

    const [stored] = await ctx.db.select().from(auditLog).where(and(eq(auditLog.companyId, t.company.id), eq(auditLog.id, Number(co.id))));
    expect(stored).toMatchObject({ action: 'amend', entity: 'visit', entityId: visitId, actorId: t.manager.user.id });
    expect(stored.changes).toMatchObject({ reason: CO_REASON });
    // "When" is the audit row's own time (written by PostgreSQL's clock in the change's transaction).
    expect(stored.at.toISOString()).toBe(co.at);
    // Every audit row of this visit is told, and none twice.
    const rows = await ctx.db.select().from(auditLog).where(and(eq(auditLog.companyId, t.company.id), eq(auditLog.entity, 'visit'), eq(auditLog.entityId, visitId)));
    expect(items.map((i) => i.id).sort()).toEqual(rows.map((r) => String(r.id)).sort());
  });

  it('pages by cursor without losing or repeating an entry', async () => {
    const whole = (await as.manager.get(visitUrl(visitId))).body as ChangesPageDto;
    expect(whole.items.length).toBeGreaterThanOrEqual(4);
    const paged = await allPages(visitUrl(visitId), 1);
    expect(paged.map((i) => i.id)).toEqual(whole.items.map((i) => i.id));
    const first = await as.manager.get(visitUrl(visitId)).query({ limit: 2 });
    expect(first.body.items).toHaveLength(2);
    expect(first.body.nextCursor).toBe(first.body.items[1].id);
  });

  it('answers owners too, and refuses technicians and homeowners (403) and the signed-out (401)', async () => {
    expect((await as.owner.get(visitUrl(visitId))).status).toBe(200);
    const tech = await as.technician.get(visitUrl(visitId));
    expect(tech.status).toBe(403);
    expect(tech.body.error.code).toBe('forbidden');
    expect((await as.homeowner.get(visitUrl(visitId))).status).toBe(403);
    expect((await as.anonymous.get(visitUrl(visitId))).status).toBe(401);
  });

  it("answers 404 for another company's visit and for a visit that does not exist", async () => {
    const res = await otherAs.manager.get(visitUrl(visitId));
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect((await as.manager.get(visitUrl(crypto.randomUUID()))).status).toBe(404);
  });

  it('answers field-level 400s for a bad page size, cursor or id', async () => {
    for (const limit of ['0', '101', 'ten', '2.5']) {
      const res = await as.manager.get(visitUrl(visitId)).query({ limit });
      expect(res.status, limit).toBe(400);
      expect(Object.keys(res.body.error.details), limit).toEqual(['limit']);
    }
    for (const cursor of ['abc', '-1', '0', '1'.repeat(30)]) {
      const res = await as.manager.get(visitUrl(visitId)).query({ cursor });
      expect(res.status, cursor).toBe(400);
      expect(Object.keys(res.body.error.details), cursor).toEqual(['cursor']);
    }
    const badId = await as.manager.get(visitUrl('not-a-uuid'));
    expect(badId.status).toBe(400);
    expect(Object.keys(badId.body.error.details)).toEqual(['id']);
  });
});

describe('GET /api/appliances/:id/changes', () => {
  it("gathers the record's own changes, its parts and its visits, in words with no codes", async () => {
    const items = await allPages(recordUrl(applianceId), 3);
    const whats = items.map((i) => i.what);
    expect(whats.slice(0, 2)).toEqual(['Amended the outcome', 'Amended the CO reading']);
    expect(whats).toEqual(
      expect.arrayContaining(['Created the life record', 'Added a part: thermocouple', "Changed the record's location", 'Started a visit (annual maintenance)', 'Completed the visit']),
    );
    const created = items.find((i) => i.what === 'Created the life record')!;
    expect(created.who).toBe(t.manager.user.name);
    expect(created.visit).toBeNull();
    expect(items.find((i) => i.what === 'Completed the visit')!.visit).toEqual({ id: visitId, visitedOn: '2026-11-18' });
    expect(items.find((i) => i.what === "Changed the record's location")!.who).toBe(t.technician.user.name);
    // No action or entity code reaches the words.
    for (const i of items) for (const words of [i.what, ...i.details]) expect(words).not.toMatch(/\b[a-z]+_[a-z_]+\b/);
    expect(whats.at(-1)).toBe('Created the life record');
  });

  it('is for owners and managers of the same company only', async () => {
    expect((await as.owner.get(recordUrl(applianceId))).status).toBe(200);
    expect((await as.technician.get(recordUrl(applianceId))).status).toBe(403);
    expect((await as.homeowner.get(recordUrl(applianceId))).status).toBe(403);
    expect((await as.anonymous.get(recordUrl(applianceId))).status).toBe(401);
    expect((await otherAs.manager.get(recordUrl(applianceId))).status).toBe(404);
    expect((await otherAs.owner.get(recordUrl(applianceId))).status).toBe(404);
  });

  it("tells the record's bookings, with the reason a booking was cancelled", async () => {
    const booked = await as.manager
      .post('/api/bookings')
      .send({ applianceIds: [applianceId], technicianId: t.technician.user.id, start: '2026-11-25T09:00', end: '2026-11-25T10:30', source: 'phone' });
    expect(booked.status, JSON.stringify(booked.body)).toBe(201);
    const reason = 'The homeowner is away that week.';
    await as.manager.post(`/api/bookings/${booked.body.id}/cancel`).send({ reason }).expect(200);
    const { items } = (await as.manager.get(recordUrl(applianceId)).query({ limit: 2 })).body as ChangesPageDto;
    expect(items.map((i) => [i.what, i.why, i.who])).toEqual([
      ['Cancelled a booked visit', reason, t.manager.user.name],
      ['Booked a visit', null, t.manager.user.name],
    ]);
    // Not the visit's: its own history is unchanged.
    const visitItems = ((await as.manager.get(visitUrl(visitId))).body as ChangesPageDto).items;
    expect(visitItems.map((i) => i.what)).not.toContain('Booked a visit');
  });

  it('answers a field-level 400 for a bad page size', async () => {
    const res = await as.manager.get(recordUrl(applianceId)).query({ limit: '-3' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.limit).toEqual(['The page size must be at least 1.']);
  });
});

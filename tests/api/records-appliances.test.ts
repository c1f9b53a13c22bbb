import { and, eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appliances, auditLog, components, timelineEvents, visits } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let siteId: string;
let otherSiteId: string;

const boiler = (overrides: Record<string, unknown> = {}) => ({
  siteId,
  kind: 'steam_boiler',
  fuel: 'natural_gas',
  construction: 'cast_iron',
  manufacturer: 'Harrowgate Foundry',
  model: 'HF-4',
  serial: 'HF4-0001',
  inputBtuh: 105000,
  installedOn: '2005-10-14',
  ignitionType: 'standing_pilot',
  ventType: 'draft_hood',
  location: 'Basement, north wall',
  ...overrides,
});
const threeParts = [
  { typeCode: 'thermocouple', spec: { lengthIn: 24 }, installedOn: '2019-11-02' },
  { typeCode: 'gauge_glass', spec: { lengthIn: 10, diameterIn: 0.625 }, originalWithAppliance: true },
  { typeCode: 'low_water_cutoff_float', originalWithAppliance: true, note: 'Blow-down valve stiff' },
];

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  siteId = (await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id, street: '9 Kiln Street' })).id;
  otherSiteId = (await insertSite(ctx.db, { companyId: other.company.id, customerId: other.customer.id })).id;
});
afterAll(() => ctx.pool.end());

describe('POST /appliances', () => {
  it('creates the appliance, its parts, the install event and audit rows in one transaction', async () => {
    const res = await as.technician.post('/api/appliances').send({ ...boiler(), components: threeParts });
    expect(res.status).toBe(201);
    const id = res.body.appliance.id;
    expect(res.body.appliance).toMatchObject({ siteId, kind: 'steam_boiler', serial: 'HF4-0001', status: 'in_service', replaces: null });
    expect(res.body.components.map((c: { typeCode: string; specKey: string }) => [c.typeCode, c.specKey])).toEqual(
      expect.arrayContaining([
        ['thermocouple', '24 in'],
        ['gauge_glass', '10 in, dia. 5/8 in'],
        ['low_water_cutoff_float', ''],
      ]),
    );
    expect(res.body.customer.id).toBe(t.customer.id);
    expect(res.body.site.street).toBe('9 Kiln Street');

    const [stored] = await ctx.db.select().from(appliances).where(eq(appliances.id, id));
    expect(stored).toMatchObject({ companyId: t.company.id, installedOn: '2005-10-14', createdBy: t.technician.user.id });
    const parts = await ctx.db.select().from(components).where(eq(components.applianceId, id));
    expect(parts).toHaveLength(3);
    expect(parts.every((p) => p.companyId === t.company.id)).toBe(true);
    const events = await ctx.db.select().from(timelineEvents).where(eq(timelineEvents.applianceId, id));
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ kind: 'install', actorId: t.technician.user.id });
    expect(events[0].occurredAt.toISOString().slice(0, 10)).toBe('2005-10-14');
    expect((events[0].data.componentIds as string[]).sort()).toEqual(parts.map((p) => p.id).sort());
    // now() is the transaction's start time, so equal created_at values show one transaction wrote all of them.
    const stamps = new Set([stored.createdAt.getTime(), events[0].createdAt.getTime(), ...parts.map((p) => p.createdAt.getTime())]);
    expect(stamps.size).toBe(1);
    const audits = await ctx.db.select().from(auditLog).where(inArray(auditLog.entityId, [id, ...parts.map((p) => p.id)]));
    expect(audits).toHaveLength(4);
  });

  it('works out due dates for the new parts', async () => {
    const res = await as.manager.post('/api/appliances').send({ ...boiler({ serial: 'DUE-1' }), components: threeParts });
    const thermocouple = res.body.components.find((c: { typeCode: string }) => c.typeCode === 'thermocouple');
    expect(thermocouple.due).toMatchObject({ kind: 'inspection', dueOn: '2020-11-02', status: 'overdue' });
    expect(res.body.due.map((d: { componentId: string }) => d.componentId)).toContain(thermocouple.id);
  });

  it('answers an unknown part type, a bad spec and a foreign site with field errors, and stores nothing', async () => {
    const res = await as.owner.post('/api/appliances').send({
      ...boiler({ siteId: otherSiteId, serial: 'NOPE-1' }),
      components: [threeParts[0], { typeCode: 'flux_capacitor', originalWithAppliance: true }, { typeCode: 'thermocouple', spec: { lengthIn: -3 }, originalWithAppliance: true }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual({
      siteId: ['Pick a site of your company.'],
      'components.1.typeCode': ['Pick one of your part types (see Parts & checklists).'],
      'components.2.spec.lengthIn': [expect.stringContaining('greater than 0')],
    });
    expect(await ctx.db.select().from(appliances).where(eq(appliances.serial, 'NOPE-1'))).toHaveLength(0);
  });

  it('answers zod failures field by field', async () => {
    const res = await as.owner.post('/api/appliances').send({ siteId, kind: 'kettle', fuel: 'natural_gas', components: [{ typeCode: 'thermocouple' }] });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['components.0.installedOn', 'construction', 'ignitionType', 'kind', 'ventType']);
  });

  it('refuses install dates in the future, for the appliance and for a part', async () => {
    const res = await as.owner.post('/api/appliances').send({
      ...boiler({ serial: 'FUT-1', installedOn: '2999-01-01' }),
      components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 }, installedOn: '2999-01-01' }],
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['components.0.installedOn', 'installedOn']);
    expect(await ctx.db.select().from(appliances).where(eq(appliances.serial, 'FUT-1'))).toHaveLength(0);
  });

  it('refuses a retired part type', async () => {
    await as.manager.patch('/api/catalog/component-types/thermopile').send({ active: false }).expect(200);
    const res = await as.owner.post('/api/appliances').send({ ...boiler({ serial: 'RET-1' }), components: [{ typeCode: 'thermopile', originalWithAppliance: true }] });
    expect(res.status).toBe(400);
    expect(res.body.error.details['components.0.typeCode']).toBeDefined();
  });

  it('refuses signed-out 401 and homeowner 403', async () => {
    expect((await as.anonymous.post('/api/appliances').send(boiler())).status).toBe(401);
    expect((await as.homeowner.post('/api/appliances').send(boiler())).status).toBe(403);
  });
});

describe('GET /appliances/:id', () => {
  it('shows the life record: parts current then removed, last visit, unsafe, draft, due and end of life', async () => {
    const a = await insertAppliance(ctx.db, {
      companyId: t.company.id,
      siteId,
      installedOn: '1990-03-01',
      components: [
        { typeCode: 'thermocouple', spec: { lengthIn: 18 }, installedOn: '2010-01-01', removedOn: '2015-01-01', removalReason: 'would not hold the pilot' },
        { typeCode: 'thermocouple', spec: { lengthIn: 18 }, installedOn: '2015-01-01', conditionFailed: true, dueOn: '2024-01-01', dueKind: 'replacement', dueReason: 'x' },
      ],
    });
    await ctx.db.insert(visits).values([
      { companyId: t.company.id, applianceId: a.id, type: 'annual_maintenance', status: 'completed', visitedOn: '2023-10-01', outcome: 'left_operating' },
      { companyId: t.company.id, applianceId: a.id, type: 'repair', status: 'completed', visitedOn: '2024-02-01', outcome: 'shut_down_unsafe', outcomeReason: 'Cracked section; CO in the flue' },
      { companyId: t.company.id, applianceId: a.id, type: 'repair', status: 'draft', visitedOn: '2024-02-03' },
    ]);
    const res = await as.technician.get(`/api/appliances/${a.id}`);
    expect(res.status).toBe(200);
    expect(res.body.components.map((c: { removedOn: string | null }) => c.removedOn)).toEqual([null, '2015-01-01']);
    expect(res.body.components[1].removalReason).toBe('would not hold the pilot');
    expect(res.body.lastVisit).toMatchObject({ visitedOn: '2024-02-01', type: 'repair', outcome: 'shut_down_unsafe' });
    expect(res.body.unsafe).toMatchObject({ visitedOn: '2024-02-01', reason: 'Cracked section; CO in the flue' });
    expect(res.body.openDraftVisitId).toEqual(expect.any(String));
    expect(res.body.due).toEqual([expect.objectContaining({ componentId: res.body.components[0].id, status: 'replace_now', typeLabel: 'thermocouple' })]);
    expect(res.body.endOfLife).toMatchObject({ medianYears: 30, status: 'past' });
    expect(res.body.endOfLife.source).toContain('ASHRAE');
    expect(res.body.ageYears).toBeGreaterThanOrEqual(35);
  });

  it('answers 404 for another company’s appliance, 403 for a homeowner, 401 signed out', async () => {
    const foreign = await insertAppliance(ctx.db, { companyId: other.company.id, siteId: otherSiteId });
    expect((await as.owner.get(`/api/appliances/${foreign.id}`)).status).toBe(404);
    expect((await as.owner.get(`/api/appliances/${foreign.id}/timeline`)).status).toBe(404);
    expect((await as.owner.patch(`/api/appliances/${foreign.id}`).send({ location: 'x' })).status).toBe(404);
    expect((await as.owner.post(`/api/appliances/${foreign.id}/components`).send({ typeCode: 'thermocouple', originalWithAppliance: true })).status).toBe(404);
    const mine = await insertAppliance(ctx.db, { companyId: t.company.id, siteId });
    expect((await as.owner.post(`/api/appliances/${foreign.id}/replace`).send({ newApplianceId: mine.id, removedOn: '2024-01-01' })).status).toBe(404);
    const [row] = await ctx.db.select().from(appliances).where(eq(appliances.id, foreign.id));
    expect(row.status).toBe('in_service');
    expect((await as.homeowner.get(`/api/appliances/${mine.id}`)).status).toBe(403);
    expect((await as.anonymous.get(`/api/appliances/${mine.id}`)).status).toBe(401);
  });
});

describe('PATCH /appliances/:id', () => {
  it('updates fields, writes a status event on a status change, and audits', async () => {
    const a = await insertAppliance(ctx.db, { companyId: t.company.id, siteId });
    const res = await as.technician.patch(`/api/appliances/${a.id}`).send({ location: 'Cellar', status: 'out_of_service', mawpPsi: 15 });
    expect(res.status).toBe(200);
    expect(res.body.appliance).toMatchObject({ location: 'Cellar', status: 'out_of_service', mawpPsi: 15 });
    const [row] = await ctx.db.select().from(appliances).where(eq(appliances.id, a.id));
    expect(row).toMatchObject({ location: 'Cellar', status: 'out_of_service', mawpPsi: 15, serial: a.serial });
    const events = await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.applianceId, a.id), eq(timelineEvents.kind, 'status')));
    expect(events).toHaveLength(1);
    expect(events[0].data).toEqual({ from: 'in_service', to: 'out_of_service' });
    const bad = await as.technician.patch(`/api/appliances/${a.id}`).send({ manufacturedMonth: 13, fuel: 'coal' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['fuel', 'manufacturedMonth']);
    expect((await as.homeowner.patch(`/api/appliances/${a.id}`).send({ location: 'x' })).status).toBe(403);
  });
});

describe('POST /appliances/:id/replace', () => {
  it('marks the old one removed, links the new one, writes status events on both; both records stay readable', async () => {
    const old = await insertAppliance(ctx.db, { companyId: t.company.id, siteId, manufacturer: 'Coldwater Ironworks', model: 'CW-2', components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 } }] });
    const successor = await insertAppliance(ctx.db, { companyId: t.company.id, siteId, kind: 'hot_water_boiler' });
    const res = await as.technician.post(`/api/appliances/${old.id}/replace`).send({ newApplianceId: successor.id, removedOn: '2024-06-01', reason: 'Cracked section' });
    expect(res.status).toBe(200);
    expect(res.body.appliance).toMatchObject({ id: old.id, status: 'removed', replacedById: successor.id });
    expect(res.body.components[0]).toMatchObject({ removedOn: '2024-06-01', due: null });
    expect(res.body.due).toEqual([]);
    const [row] = await ctx.db.select().from(appliances).where(eq(appliances.id, old.id));
    expect(row).toMatchObject({ status: 'removed', replacedById: successor.id });

    const oldEvents = await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.applianceId, old.id), eq(timelineEvents.kind, 'status')));
    const newEvents = await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.applianceId, successor.id), eq(timelineEvents.kind, 'status')));
    expect(oldEvents).toHaveLength(1);
    expect(newEvents).toHaveLength(1);
    expect(newEvents[0].summary).toContain('Coldwater Ironworks CW-2');

    const next = await as.owner.get(`/api/appliances/${successor.id}`);
    expect(next.body.appliance.replaces).toEqual({ id: old.id, label: expect.stringContaining('Coldwater Ironworks CW-2') });
    expect((await as.owner.get(`/api/appliances/${old.id}`)).status).toBe(200);

    const again = await as.owner.post(`/api/appliances/${old.id}/replace`).send({ newApplianceId: successor.id, removedOn: '2024-06-01' });
    expect(again.status).toBe(409);
  });

  it('refuses itself, a foreign successor and a future date with field errors', async () => {
    const a = await insertAppliance(ctx.db, { companyId: t.company.id, siteId });
    const foreign = await insertAppliance(ctx.db, { companyId: other.company.id, siteId: otherSiteId });
    const self = await as.owner.post(`/api/appliances/${a.id}/replace`).send({ newApplianceId: a.id, removedOn: '2024-01-01' });
    expect(self.body.error.details.newApplianceId).toEqual(['An appliance cannot replace itself.']);
    const res = await as.owner.post(`/api/appliances/${a.id}/replace`).send({ newApplianceId: foreign.id, removedOn: '2999-01-01' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['newApplianceId', 'removedOn']);
    const zod = await as.owner.post(`/api/appliances/${a.id}/replace`).send({ newApplianceId: 'x', removedOn: 'yesterday' });
    expect(Object.keys(zod.body.error.details).sort()).toEqual(['newApplianceId', 'removedOn']);
    const [row] = await ctx.db.select().from(appliances).where(eq(appliances.id, a.id));
    expect(row.status).toBe('in_service');
    expect((await as.homeowner.post(`/api/appliances/${a.id}/replace`).send({ newApplianceId: a.id, removedOn: '2024-01-01' })).status).toBe(403);
  });
});

describe('POST /appliances/:id/components', () => {
  it('adds a part with its spec key, a note on the timeline and an audit row', async () => {
    const a = await insertAppliance(ctx.db, { companyId: t.company.id, siteId });
    const res = await as.technician
      .post(`/api/appliances/${a.id}/components`)
      .send({ typeCode: 'safety_valve', spec: { setPressurePsi: 15, inletSizeIn: 0.75 }, installedOn: '2021-09-09' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ typeCode: 'safety_valve', typeLabel: 'steam safety valve', specKey: '15 psi, inlet 3/4 in', installedOn: '2021-09-09' });
    const [row] = await ctx.db.select().from(components).where(eq(components.id, res.body.id));
    expect(row).toMatchObject({ applianceId: a.id, companyId: t.company.id, specKey: '15 psi, inlet 3/4 in' });
    const [event] = await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.applianceId, a.id), eq(timelineEvents.refId, res.body.id)));
    expect(event.summary).toContain('steam safety valve');
    const bad = await as.technician.post(`/api/appliances/${a.id}/components`).send({ typeCode: 'safety_valve', spec: { colour: 'red' }, originalWithAppliance: true });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details['spec.colour']).toBeDefined();
    expect((await as.homeowner.post(`/api/appliances/${a.id}/components`).send({ typeCode: 'thermocouple', originalWithAppliance: true })).status).toBe(403);
  });
});

describe('GET /appliances/:id/timeline', () => {
  it('pages newest first by keyset, pages disjoint and in order, and filters by kind', async () => {
    const a = await insertAppliance(ctx.db, { companyId: t.company.id, siteId });
    const same = new Date('2020-05-05T12:00:00Z');
    await ctx.db.insert(timelineEvents).values(
      Array.from({ length: 7 }, (_, i) => ({
        companyId: t.company.id,
        applianceId: a.id,
        // Three events share one instant, so the id breaks the tie.
        occurredAt: i < 3 ? same : new Date(Date.UTC(2010 + i, 0, 1)),
        kind: i % 2 ? ('visit' as const) : ('note' as const),
        summary: `event ${i}`,
      })),
    );
    const seen: { id: number; occurredAt: string }[] = [];
    let before: string | null = null;
    let pages = 0;
    do {
      const res = await as.technician.get(`/api/appliances/${a.id}/timeline`).query(before ? { limit: 3, before } : { limit: 3 });
      expect(res.status).toBe(200);
      expect(res.body.items.length).toBeLessThanOrEqual(3);
      seen.push(...res.body.items);
      before = res.body.nextCursor;
      pages++;
    } while (before && pages < 10);
    expect(pages).toBe(3);
    expect(seen).toHaveLength(7);
    expect(new Set(seen.map((e) => e.id)).size).toBe(7);
    const order = seen.map((e) => [e.occurredAt, e.id] as const);
    const sorted = [...order].sort((x, y) => (x[0] === y[0] ? y[1] - x[1] : y[0].localeCompare(x[0])));
    expect(order).toEqual(sorted);

    const visitsOnly = await as.technician.get(`/api/appliances/${a.id}/timeline`).query({ kind: 'visit' });
    expect(visitsOnly.body.items.every((e: { kind: string }) => e.kind === 'visit')).toBe(true);
    expect(visitsOnly.body.items).toHaveLength(3);
    const bad = await as.technician.get(`/api/appliances/${a.id}/timeline`).query({ kind: 'party', limit: 1000 });
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['kind', 'limit']);
    expect((await as.homeowner.get(`/api/appliances/${a.id}/timeline`)).status).toBe(403);
  });
});


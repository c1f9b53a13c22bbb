import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, bookings, serviceRequests, timelineEvents, visits } from '../../server/db/schema/index';
import { insertAppliance, insertComponent, insertSite } from '../../server/db/factories/records';
import { testApp } from '../support/context';
import { runFileAt } from '../support/clock';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';
import { fullCompletion } from '../support/visit-completion';

// The company works in New York; the clock reads Wed Nov 18, 2026, noon there.
runFileAt('2026-11-18T12:00:00-05:00');

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherAs: Awaited<ReturnType<typeof agentsFor>>;
let siteId: string;
let boilerId: string;
let heaterId: string;
let elsewhereId: string;
let otherBoilerId: string;

const book = (over: Record<string, unknown> = {}) => ({
  applianceIds: [boilerId],
  technicianId: t.technician.user.id,
  start: '2026-11-24T09:00',
  end: '2026-11-24T11:00',
  source: 'due_list',
  ...over,
});
const stored = (id: string) => ctx.db.select().from(bookings).where(eq(bookings.id, id)).then((r) => r[0]);

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  otherAs = await agentsFor(app, other);
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id, town: 'Alder Falls' });
  siteId = site.id;
  boilerId = (
    await insertAppliance(ctx.db, {
      companyId: t.company.id,
      siteId,
      components: [
        { typeCode: 'thermocouple', spec: { lengthIn: 24 }, installedOn: '2019-01-01', dueOn: '2026-11-01', dueKind: 'replacement' },
        { typeCode: 'gauge_glass', spec: {}, installedOn: '2020-01-01', conditionFailed: true },
      ],
    })
  ).id;
  heaterId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId, kind: 'water_heater' })).id;
  await insertComponent(ctx.db, { companyId: t.company.id, applianceId: heaterId, typeCode: 'thermocouple', spec: { lengthIn: 24 }, dueOn: '2026-11-20', dueKind: 'replacement' });
  const elsewhere = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
  elsewhereId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: elsewhere.id })).id;
  const otherSite = await insertSite(ctx.db, { companyId: other.company.id, customerId: other.customer.id });
  otherBoilerId = (await insertAppliance(ctx.db, { companyId: other.company.id, siteId: otherSite.id })).id;
});
afterAll(() => ctx.pool.end());

describe('booking a visit', () => {
  it('books two appliances at one site as one visit, in the company’s zone, with timeline and audit', async () => {
    const res = await as.manager.post('/api/bookings').send(book({ applianceIds: [boilerId, heaterId], note: 'Side door; dog in the yard' }));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      status: 'booked',
      source: 'due_list',
      start: '2026-11-24T09:00',
      end: '2026-11-24T11:00',
      // Source: 15 U.S.C. 260a: New York is on standard time (UTC−5) in late November.
      startsAt: '2026-11-24T14:00:00.000Z',
      timeZone: 'America/New_York',
      technician: { id: t.technician.user.id },
      site: { id: siteId, town: 'Alder Falls' },
      note: 'Side door; dog in the yard',
    });
    expect(res.body.appliances.map((a: { id: string }) => a.id).sort()).toEqual([boilerId, heaterId].sort());
    const row = await stored(res.body.id);
    expect(row).toMatchObject({ siteId, technicianId: t.technician.user.id, status: 'booked', createdBy: t.manager.user.id });
    const events = await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.refId, res.body.id), eq(timelineEvents.kind, 'booking')));
    expect(events.map((e) => e.applianceId).sort()).toEqual([boilerId, heaterId].sort());
    const audit = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entity, 'booking'), eq(auditLog.entityId, res.body.id)));
    expect(audit.map((a) => a.action)).toEqual(['booked']);
  });

  it('keeps 09:00 at 09:00 on the day the clocks change', async () => {
    const res = await as.manager.post('/api/bookings').send(book({ start: '2027-03-14T09:00', end: '2027-03-14T10:30' }));
    expect(res.status).toBe(201);
    // Source: 15 U.S.C. 260a: daylight time begins the second Sunday of March (Mar 14, 2027), New York on UTC−4.
    expect(res.body.startsAt).toBe('2027-03-14T13:00:00.000Z');
    expect(res.body.start).toBe('2027-03-14T09:00');
    const before = await as.manager.post('/api/bookings').send(book({ start: '2027-03-13T09:00', end: '2027-03-13T10:30' }));
    expect(before.body.startsAt).toBe('2027-03-13T14:00:00.000Z');
  });

  it('refuses an overlap with a 409 naming the other booking, and exactly one of two racing requests wins', async () => {
    const clash = await as.manager.post('/api/bookings').send(book({ applianceIds: [elsewhereId], start: '2026-11-24T10:00', end: '2026-11-24T12:00' }));
    expect(clash.status).toBe(409);
    expect(clash.body.error.code).toBe('booking_clash');
    expect(clash.body.error.message).toMatch(/already booked .*Alder Falls/);

    const race = book({ applianceIds: [elsewhereId], start: '2026-11-25T13:00', end: '2026-11-25T14:00' });
    const results = await Promise.all([as.manager.post('/api/bookings').send(race), as.owner.post('/api/bookings').send(race)]);
    expect(results.map((r) => r.status).sort()).toEqual([201, 409]);
    const rows = await ctx.db.select().from(bookings).where(and(eq(bookings.companyId, t.company.id), eq(bookings.technicianId, t.technician.user.id)));
    expect(rows.filter((r) => r.startsAt.toISOString() === '2026-11-25T18:00:00.000Z')).toHaveLength(1);
  });

  it('gives field-level 400s and writes nothing', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ start: '2026-11-17T09:00', end: '2026-11-17T10:00' }, 'start'],
      [{ start: '2026-11-26T11:00', end: '2026-11-26T10:00' }, 'end'],
      [{ start: '2026-11-26T09:00', end: '2026-11-27T10:00' }, 'end'],
      [{ technicianId: other.technician.user.id }, 'technicianId'],
      [{ applianceIds: [boilerId, elsewhereId] }, 'applianceIds'],
      [{ start: '2026-02-30T09:00' }, 'start'],
    ];
    const before = (await ctx.db.select().from(bookings).where(eq(bookings.companyId, t.company.id))).length;
    for (const [over, field] of cases) {
      const res = await as.manager.post('/api/bookings').send(book({ start: '2026-11-26T09:00', end: '2026-11-26T10:00', ...over }));
      expect(res.status, JSON.stringify(over)).toBe(400);
      expect(Object.keys(res.body.error.details)).toContain(field);
    }
    expect((await ctx.db.select().from(bookings).where(eq(bookings.companyId, t.company.id))).length).toBe(before);
  });

  it('enforces roles and tenants', async () => {
    expect((await as.anonymous.post('/api/bookings').send(book())).status).toBe(401);
    expect((await as.homeowner.get('/api/bookings?from=2026-11-23&to=2026-11-29')).status).toBe(403);
    const forSomeoneElse = await as.technician.post('/api/bookings').send(book({ technicianId: t.manager.user.id, start: '2026-11-30T09:00', end: '2026-11-30T10:00' }));
    expect(forSomeoneElse.status).toBe(403);
    const followUp = await as.technician.post('/api/bookings').send(book({ source: 'follow_up', start: '2026-11-30T09:00', end: '2026-11-30T10:00' }));
    expect(followUp.status).toBe(201);
    expect((await as.technician.post(`/api/bookings/${followUp.body.id}/cancel`).send({ reason: 'no' })).status).toBe(403);
    expect((await otherAs.manager.get(`/api/bookings/${followUp.body.id}`)).status).toBe(404);
    expect((await otherAs.manager.post(`/api/bookings/${followUp.body.id}/move`).send({ start: '2026-12-01T09:00', end: '2026-12-01T10:00' })).status).toBe(404);
    expect((await as.manager.post('/api/bookings').send(book({ applianceIds: [otherBoilerId] }))).status).toBe(404);
  });
});

describe('moving, cancelling, the round and the load list', () => {
  it('moves a booking, then refuses to move it once cancelled', async () => {
    const made = await as.manager.post('/api/bookings').send(book({ applianceIds: [elsewhereId], start: '2026-12-01T13:00', end: '2026-12-01T14:00' }));
    const moved = await as.manager.post(`/api/bookings/${made.body.id}/move`).send({ start: '2026-12-02T08:00', end: '2026-12-02T09:00', technicianId: t.manager.user.id });
    expect(moved.status).toBe(200);
    expect(moved.body).toMatchObject({ start: '2026-12-02T08:00', technician: { id: t.manager.user.id } });
    expect(await stored(made.body.id)).toMatchObject({ technicianId: t.manager.user.id, startsAt: new Date('2026-12-02T13:00:00Z') });

    const cancelled = await as.manager.post(`/api/bookings/${made.body.id}/cancel`).send({ reason: 'Customer away' });
    expect(cancelled.body).toMatchObject({ status: 'cancelled', statusReason: 'Customer away' });
    const again = await as.manager.post(`/api/bookings/${made.body.id}/move`).send({ start: '2026-12-03T08:00', end: '2026-12-03T09:00' });
    expect(again.status).toBe(400);
    expect(again.body.error.details._[0]).toMatch(/cancelled/);
    expect((await stored(made.body.id)).startsAt).toEqual(new Date('2026-12-02T13:00:00Z'));
    // The cancelled booking freed the time.
    const rebooked = await as.manager.post('/api/bookings').send(book({ applianceIds: [elsewhereId], technicianId: t.manager.user.id, start: '2026-12-02T08:00', end: '2026-12-02T09:00' }));
    expect(rebooked.status).toBe(201);
  });

  it('shows the technician’s round in time order with its load list grouped by part specification', async () => {
    const res = await as.technician.get('/api/rounds?date=2026-11-24');
    expect(res.status).toBe(200);
    expect(res.body.technician.id).toBe(t.technician.user.id);
    expect(res.body.bookings).toHaveLength(1);
    const [round] = res.body.bookings;
    expect(round.appliances.find((a: { id: string }) => a.id === boilerId).due.join(' ')).toMatch(/replace/);
    const lines = res.body.loadList.lines as { label: string; count: number; reasons: string[] }[];
    // Two thermocouples due by age (boiler and water heater), one gauge glass by condition.
    expect(lines.find((l) => /thermocouple/i.test(l.label))).toMatchObject({ count: 2, reasons: ['age'] });
    expect(lines.find((l) => /gauge glass/i.test(l.label))).toMatchObject({ count: 1, reasons: ['condition'] });
    const board = await as.manager.get('/api/bookings?from=2026-11-23&to=2026-11-29');
    expect(board.status).toBe(200);
    expect(board.body.technicians.map((x: { id: string }) => x.id)).toContain(t.technician.user.id);
    expect(board.body.bookings.length).toBeGreaterThanOrEqual(2);
  });

  it('starts a visit from the booking and marks the booking done once every booked appliance is completed', async () => {
    const made = await as.manager.post('/api/bookings').send(book({ start: '2026-11-18T15:00', end: '2026-11-18T16:00' }));
    expect(made.status).toBe(201);
    const wrong = await as.technician.post('/api/visits').send({ applianceId: heaterId, type: 'annual_maintenance', bookingId: made.body.id });
    expect(wrong.status).toBe(400);
    // The record offers the booked visit on its day: 15:00 today in New York.
    const record = await as.technician.get(`/api/appliances/${boilerId}`);
    expect(record.body.nextBooking).toMatchObject({ id: made.body.id, start: '2026-11-18T15:00', end: '2026-11-18T16:00', isToday: true });
    const started = await as.technician.post('/api/visits').send({ applianceId: boilerId, type: 'annual_maintenance', bookingId: made.body.id });
    expect(started.status).toBe(200);
    expect((await ctx.db.select().from(visits).where(eq(visits.id, started.body.id)))[0].bookingId).toBe(made.body.id);
    const done = await as.technician.post(`/api/visits/${started.body.id}/complete`).send(fullCompletion(started.body));
    expect(done.status).toBe(200);
    expect((await stored(made.body.id)).status).toBe('done');
    const dto = await as.manager.get(`/api/bookings/${made.body.id}`);
    expect(dto.body).toMatchObject({ status: 'done', visitIds: [started.body.id] });
    const after = await as.technician.get(`/api/appliances/${boilerId}`);
    expect(after.body.nextBooking?.id).not.toBe(made.body.id);
  });

  it('books from a service request: the request is scheduled and shows its booking', async () => {
    const [request] = await ctx.db
      .insert(serviceRequests)
      .values({ companyId: t.company.id, applianceId: elsewhereId, customerId: t.customer.id, via: 'homeowner_account', contactName: 'Ines Varga', message: 'No heat upstairs' })
      .returning();
    const made = await as.manager.post('/api/bookings').send(book({ applianceIds: [elsewhereId], source: 'service_request', serviceRequestId: request.id, start: '2026-12-01T13:00', end: '2026-12-01T14:00' }));
    expect(made.status).toBe(201);
    expect(await stored(made.body.id)).toMatchObject({ serviceRequestId: request.id, source: 'service_request' });
    const list = await as.manager.get('/api/service-requests');
    const item = list.body.items.find((i: { id: string }) => i.id === request.id);
    // Source: 15 U.S.C. 260a: 13:00 in New York on Dec 1 is 18:00 UTC.
    expect(item).toMatchObject({ status: 'scheduled', booking: { id: made.body.id, startsAt: '2026-12-01T18:00:00Z' } });
  });

  it('records no access with its reason', async () => {
    const made = await as.manager.post('/api/bookings').send(book({ applianceIds: [elsewhereId], start: '2026-12-04T09:00', end: '2026-12-04T10:00' }));
    const res = await as.technician.post(`/api/bookings/${made.body.id}/no-access`).send({ reason: 'Nobody home, card left' });
    expect(res.status).toBe(200);
    expect(await stored(made.body.id)).toMatchObject({ status: 'no_access', statusReason: 'Nobody home, card left' });
    expect((await as.technician.post(`/api/bookings/${made.body.id}/no-access`).send({ reason: '' })).status).toBe(400);
  });
});

import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { insertBooking } from '../../server/db/factories/bookings';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { DEFAULT_BOOKING_MINUTES } from '../../shared/schemas/bookings';
import { testApp } from '../support/context';
import { runFileAt } from '../support/clock';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

// The company works in New York; the clock reads Wed Nov 18, 2026, noon there.
runFileAt('2026-11-18T12:00:00-05:00');

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherAs: Awaited<ReturnType<typeof agentsFor>>;
const ids: Record<string, string> = {};

const week = { from: '2026-11-23', to: '2026-11-28' };
const queue = (query: Record<string, string> = {}) => as.manager.get('/api/bookings/unbooked').query({ ...week, ...query });
const applianceIds = (body: { items: { appliance: { id: string } }[] }) => body.items.map((i) => i.appliance.id);

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  otherAs = await agentsFor(app, other);
  const assigned = await insertSite(ctx.db, {
    companyId: t.company.id,
    customerId: t.customer.id,
    street: '12 Quillby Lane',
    town: 'Alder Falls',
    assignedTechnicianId: t.technician.user.id,
  });
  const plain = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id, street: '4 Marrow Row', town: 'Fenwick Hollow' });
  const add = (siteId: string, kind: 'steam_boiler' | 'water_heater', fuel: 'natural_gas' | 'propane', components: Parameters<typeof insertAppliance>[1]['components']) =>
    insertAppliance(ctx.db, { companyId: t.company.id, siteId, kind, fuel, components }).then((a) => a.id);
  // Overdue since November 1st.
  ids.overdue = await add(assigned.id, 'steam_boiler', 'natural_gas', [
    { typeCode: 'thermocouple', spec: { lengthIn: 24 }, installedOn: '2019-01-01', dueOn: '2026-11-01', dueKind: 'replacement' },
  ]);
  // Due inside the week.
  ids.inWeek = await add(plain.id, 'water_heater', 'propane', [{ typeCode: 'thermocouple', spec: { lengthIn: 18 }, dueOn: '2026-11-26', dueKind: 'replacement' }]);
  // Failed at the last check: due now whatever its date.
  ids.failed = await add(plain.id, 'steam_boiler', 'propane', [{ typeCode: 'gauge_glass', spec: {}, installedOn: '2020-01-01', conditionFailed: true }]);
  // Due after the week: not in the queue.
  ids.later = await add(plain.id, 'steam_boiler', 'natural_gas', [{ typeCode: 'thermocouple', spec: { lengthIn: 24 }, dueOn: '2026-12-15', dueKind: 'replacement' }]);
  // Due, but booked for next week: not in the queue.
  ids.booked = await add(assigned.id, 'water_heater', 'natural_gas', [{ typeCode: 'thermocouple', spec: { lengthIn: 24 }, dueOn: '2026-11-10', dueKind: 'replacement' }]);
  await insertBooking(ctx.db, { companyId: t.company.id, siteId: assigned.id, technicianId: t.technician.user.id, applianceIds: [ids.booked], start: '2026-11-24T09:00', end: '2026-11-24T10:00' });
  // Due, booked once but that booking was cancelled: back in the queue.
  ids.cancelled = await add(assigned.id, 'steam_boiler', 'natural_gas', [{ typeCode: 'thermocouple', spec: { lengthIn: 24 }, dueOn: '2026-11-12', dueKind: 'replacement' }]);
  await insertBooking(ctx.db, {
    companyId: t.company.id,
    siteId: assigned.id,
    technicianId: t.technician.user.id,
    applianceIds: [ids.cancelled],
    status: 'cancelled',
    start: '2026-11-24T11:00',
    end: '2026-11-24T12:00',
  });
  // Another company's overdue boiler.
  const otherSite = await insertSite(ctx.db, { companyId: other.company.id, customerId: other.customer.id, town: 'Alder Falls' });
  ids.otherCompany = (
    await insertAppliance(ctx.db, {
      companyId: other.company.id,
      siteId: otherSite.id,
      components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 }, dueOn: '2026-11-01', dueKind: 'replacement' }],
    })
  ).id;
});
afterAll(() => ctx.pool.end());

describe('GET /bookings/unbooked', () => {
  it('lists what is due by the end of the week and not booked, earliest first, with words, the team and the window lengths', async () => {
    const res = await queue();
    expect(res.status).toBe(200);
    // Failed at the last check counts as due today (Nov 18), after Nov 1 and Nov 12, before Nov 26.
    expect(applianceIds(res.body)).toEqual([ids.overdue, ids.cancelled, ids.failed, ids.inWeek]);
    expect(res.body.items[0]).toEqual({
      appliance: { id: ids.overdue, kind: 'steam_boiler', fuel: 'natural_gas', title: 'Steam boiler, natural gas' },
      site: {
        id: expect.any(String),
        street: '12 Quillby Lane',
        town: 'Alder Falls',
        assignedTechnicianId: t.technician.user.id,
        assignedTechnicianName: t.technician.user.name,
      },
      customer: { id: t.customer.id, name: t.customer.name },
      firstDueOn: '2026-11-01',
      overdue: true,
      due: ['thermocouple, 24 in: replace (due Nov 1, 2026)'],
    });
    expect(res.body.items[2]).toMatchObject({ firstDueOn: '2026-11-18', overdue: false, due: ['gauge glass: failed at the last check, replace'] });
    expect(res.body.items[3]).toMatchObject({ firstDueOn: '2026-11-26', overdue: false });
    expect(res.body.nextCursor).toBeNull();
    expect(res.body.technicians).toEqual([{ id: t.technician.user.id, name: t.technician.user.name }]);
    expect(res.body.bookingMinutes).toEqual(DEFAULT_BOOKING_MINUTES);
  });

  it('filters by kind, fuel, town, search and assigned technician', async () => {
    expect(applianceIds((await queue({ applianceKind: 'water_heater' })).body)).toEqual([ids.inWeek]);
    expect(applianceIds((await queue({ fuel: 'propane' })).body)).toEqual([ids.failed, ids.inWeek]);
    expect(applianceIds((await queue({ town: 'alder falls' })).body)).toEqual([ids.overdue, ids.cancelled]);
    expect(applianceIds((await queue({ search: 'marrow' })).body)).toEqual([ids.failed, ids.inWeek]);
    // A pattern character is searched for as itself.
    expect(applianceIds((await queue({ search: '%' })).body)).toEqual([]);
    expect(applianceIds((await queue({ technicianId: t.technician.user.id })).body)).toEqual([ids.overdue, ids.cancelled]);
  });

  it('pages along (first due, id) without repeats', async () => {
    const first = await queue({ limit: '3' });
    expect(applianceIds(first.body)).toEqual([ids.overdue, ids.cancelled, ids.failed]);
    expect(first.body.nextCursor).toEqual(expect.any(String));
    const second = await queue({ limit: '3', after: first.body.nextCursor });
    expect(applianceIds(second.body)).toEqual([ids.inWeek]);
    expect(second.body.nextCursor).toBeNull();
  });

  it('never shows another company’s appliances, and the other company sees only its own', async () => {
    expect(applianceIds((await queue()).body)).not.toContain(ids.otherCompany);
    const theirs = await otherAs.manager.get('/api/bookings/unbooked').query(week);
    expect(theirs.status).toBe(200);
    expect(applianceIds(theirs.body)).toEqual([ids.otherCompany]);
    expect(theirs.body.technicians).toEqual([{ id: other.technician.user.id, name: other.technician.user.name }]);
  });

  it('answers 400 naming the fields of a bad query', async () => {
    const res = await as.manager.get('/api/bookings/unbooked').query({ from: '2026-11-28', to: '2026-11-23', applianceKind: 'kettle', limit: '0', technicianId: 'x' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['applianceKind', 'limit', 'technicianId']);
    const reversed = await as.manager.get('/api/bookings/unbooked').query({ from: '2026-11-28', to: '2026-11-23' });
    expect(reversed.status).toBe(400);
    expect(reversed.body.error.details.to).toEqual(['The last day must be on or after the first.']);
    const missing = await as.manager.get('/api/bookings/unbooked');
    expect(Object.keys(missing.body.error.details).sort()).toEqual(['from', 'to']);
    const cursor = await queue({ after: 'nonsense' });
    expect(cursor.status).toBe(400);
    expect(cursor.body.error.details.after).toEqual(['Not a valid cursor.']);
  });

  it('is the office’s: 401 signed out, 403 for a technician and a homeowner, 200 for the owner', async () => {
    expect((await as.anonymous.get('/api/bookings/unbooked').query(week)).status).toBe(401);
    expect((await as.technician.get('/api/bookings/unbooked').query(week)).status).toBe(403);
    expect((await as.homeowner.get('/api/bookings/unbooked').query(week)).status).toBe(403);
    expect((await as.owner.get('/api/bookings/unbooked').query(week)).status).toBe(200);
  });
});

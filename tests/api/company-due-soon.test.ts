import { and, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { auditLog, companies, reminders } from '../../server/db/schema/index';
import { insertAppliance, insertComponent, insertCustomer, insertSite } from '../../server/db/factories/records';
import { runReminders } from '../../server/modules/reminders/reminders.service';
import { todayInTimeZone } from '../../shared/dates';
import { addDays } from '../../shared/trade/iso-date';
import { runFileAt } from '../support/clock';
import { testApp } from '../support/context';
import { uniqueEmail } from '../support/outbox';
import { useTenantFixture } from '../support/tenant-fixture';

const { app, ctx } = testApp();
// A Wednesday noon in the company's zone (New York): "today" and the dates worked out from it stay put.
runFileAt('2026-11-18T12:00:00-05:00');
const f = useTenantFixture(app, ctx);

const stored = async () => (await ctx.db.select().from(companies).where(eq(companies.id, f.t.company.id)))[0];
const setWindow = (days: number) => ctx.db.update(companies).set({ dueSoonDays: days }).where(eq(companies.id, f.t.company.id));

let applianceId: string;
let componentId: string;
let today: string;

beforeAll(async () => {
  today = todayInTimeZone(f.t.company.timeZone);
  const customer = await insertCustomer(ctx.db, { companyId: f.t.company.id, email: uniqueEmail() });
  const site = await insertSite(ctx.db, { companyId: f.t.company.id, customerId: customer.id });
  // Serviced last month, so the only reminder this appliance can get is the part's.
  const appliance = await insertAppliance(ctx.db, { companyId: f.t.company.id, siteId: site.id, installedOn: addDays(today, -20) });
  applianceId = appliance.id;
  // A thermocouple due for replacement in 45 days: outside a 30-day window, inside the default 60.
  const part = await insertComponent(ctx.db, {
    companyId: f.t.company.id,
    applianceId,
    typeCode: 'thermocouple',
    spec: { lengthIn: 24 },
    dueOn: addDays(today, 45),
    dueKind: 'replacement',
    dueReason: 'replacement age 5 years (installed Jan 3, 2022)',
  });
  componentId = part.id;
});

describe('the company\'s "due soon" window (companies.due_soon_days)', () => {
  it('is 60 days until the company sets its own', async () => {
    const res = await f.as.technician.get('/api/company');
    expect(res.status).toBe(200);
    expect(res.body.dueSoonDays).toBe(60);
    expect((await stored()).dueSoonDays).toBe(60);
  });

  it('is set by the owner: the answer and the stored row carry it, and the change is audited', async () => {
    const res = await f.as.owner.patch('/api/company').send({ dueSoonDays: 90 });
    expect(res.status).toBe(200);
    expect(res.body.dueSoonDays).toBe(90);
    expect((await stored()).dueSoonDays).toBe(90);
    const audits = await ctx.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.companyId, f.t.company.id), eq(auditLog.entity, 'company')));
    expect(audits.map((a) => a.changes)).toContainEqual({ dueSoonDays: 90 });
    // The bounds are allowed.
    expect((await f.as.owner.patch('/api/company').send({ dueSoonDays: 7 })).body.dueSoonDays).toBe(7);
    expect((await f.as.owner.patch('/api/company').send({ dueSoonDays: 180 })).body.dueSoonDays).toBe(180);
    expect((await stored()).dueSoonDays).toBe(180);
  });

  it.each([
    [6, /At least 7 days/],
    [181, /At most 180 days/],
    [30.5, /whole days/],
    ['sixty', /number of days/],
    [null, /number of days/],
  ])('refuses %j with a message on the field, writing nothing', async (value, message) => {
    const before = (await stored()).dueSoonDays;
    const res = await f.as.owner.patch('/api/company').send({ dueSoonDays: value });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details.dueSoonDays.join(' ')).toMatch(message);
    expect((await stored()).dueSoonDays).toBe(before);
  });

  it('is changed by the owner only: 401 signed out, 403 for managers and technicians', async () => {
    const before = (await stored()).dueSoonDays;
    expect((await f.as.anonymous.patch('/api/company').send({ dueSoonDays: 30 })).status).toBe(401);
    expect((await f.as.manager.patch('/api/company').send({ dueSoonDays: 30 })).status).toBe(403);
    expect((await f.as.technician.patch('/api/company').send({ dueSoonDays: 30 })).status).toBe(403);
    expect((await stored()).dueSoonDays).toBe(before);
  });

  it('decides "due soon" on the life record', async () => {
    await setWindow(30);
    const narrow = await f.as.technician.get(`/api/appliances/${applianceId}`);
    expect(narrow.status).toBe(200);
    expect(narrow.body.due).toEqual([expect.objectContaining({ componentId, status: 'ok' })]);
    await setWindow(60);
    const wide = await f.as.technician.get(`/api/appliances/${applianceId}`);
    expect(wide.body.due).toEqual([expect.objectContaining({ componentId, status: 'due_soon' })]);
  });

  it('decides "due soon" on the due list; beyond it, inside the list\'s window, an item reads "later"', async () => {
    await setWindow(30);
    const narrow = await f.as.manager.get('/api/due?withinDays=90');
    expect(narrow.status).toBe(200);
    expect(narrow.body.items.find((i: { componentId: string }) => i.componentId === componentId)).toMatchObject({ status: 'later' });
    await setWindow(45);
    const wide = await f.as.manager.get('/api/due?withinDays=90');
    expect(wide.body.items.find((i: { componentId: string }) => i.componentId === componentId)).toMatchObject({ status: 'due_soon' });
  });

  it('decides when a part due for replacement is reminded', async () => {
    const partReminders = () => ctx.db.select().from(reminders).where(and(eq(reminders.companyId, f.t.company.id), eq(reminders.kind, 'part_due')));
    await setWindow(30);
    await runReminders(ctx, { companyId: f.t.company.id });
    expect(await partReminders()).toEqual([]);
    await setWindow(60);
    await runReminders(ctx, { companyId: f.t.company.id });
    expect(await partReminders()).toEqual([expect.objectContaining({ componentId, dueOn: addDays(today, 45), status: 'sent' })]);
  });
});

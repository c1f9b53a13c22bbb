import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeupWaterEntries, timelineEvents } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';
import { runFileAt } from '../support/clock';

const { app, ctx } = testApp();
// 06:30 in New York (the tenant's zone) is 11:30 UTC: today's noon UTC still lies ahead.
const NOW = '2026-11-18T06:30:00-05:00';
runFileAt(NOW);
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let boilerId: string;
let otherBoilerId: string;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
  boilerId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id })).id;
  const otherSite = await insertSite(ctx.db, { companyId: other.company.id, customerId: other.customer.id });
  otherBoilerId = (await insertAppliance(ctx.db, { companyId: other.company.id, siteId: otherSite.id })).id;
});
afterAll(() => ctx.pool.end());

const url = (id: string) => `/api/appliances/${id}/makeup-water`;

describe('makeup-water log', () => {
  it('records meter readings, stores them, writes the timeline and works out the rate', async () => {
    // A feeder meter read every two weeks, 5 gallons each time: a steady loss of about 2.5 gal/week.
    const days = ['2026-01-05', '2026-01-19', '2026-02-02', '2026-02-16', '2026-03-02'];
    let res;
    for (const [i, day] of days.entries()) {
      res = await as.technician.post(url(boilerId)).send({ kind: 'meter_reading', recordedOn: day, gallons: 100 + i * 5 });
      expect(res.status).toBe(201);
    }
    expect(res!.body.entries).toHaveLength(5);
    expect(res!.body.analysis.gallonsPerWeek).toBeCloseTo(2.5, 5);
    // Fills every 14 days is more often than about once a month. common practice
    expect(res!.body.analysis.flags.map((f: { code: string }) => f.code)).toContain('water_added_more_than_monthly');

    const stored = await ctx.db.select().from(makeupWaterEntries).where(eq(makeupWaterEntries.applianceId, boilerId));
    expect(stored.map((r) => r.gallons).sort()).toEqual([100, 105, 110, 115, 120]);
    const events = await ctx.db
      .select()
      .from(timelineEvents)
      .where(and(eq(timelineEvents.applianceId, boilerId), eq(timelineEvents.kind, 'makeup_water')));
    expect(events).toHaveLength(5);
    expect(events.map((e) => e.summary)).toContain('Makeup-water meter read 120 gal');
  });

  it('refuses a meter reading that runs backwards, and stores nothing', async () => {
    const res = await as.technician.post(url(boilerId)).send({ kind: 'meter_reading', recordedOn: '2026-03-16', gallons: 50 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details)).toEqual(['gallons']);
    const stored = await ctx.db.select().from(makeupWaterEntries).where(eq(makeupWaterEntries.applianceId, boilerId));
    expect(stored).toHaveLength(5);
  });

  it('answers field errors for bad input', async () => {
    const res = await as.technician.post(url(boilerId)).send({ kind: 'meter_reading', recordedOn: 'last tuesday', gallons: -3 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['gallons', 'recordedOn']);
  });

  it('accepts water added by hand with an unknown amount', async () => {
    const res = await as.manager.post(url(boilerId)).send({ kind: 'added_by_hand', recordedOn: '2026-03-20', note: 'homeowner topped up' });
    expect(res.status).toBe(201);
    expect(res.body.entries.at(-1)).toMatchObject({ kind: 'added_by_hand', gallons: null, note: 'homeowner topped up' });
  });

  it('401 signed out, 403 for a homeowner, 404 for another company’s boiler', async () => {
    expect((await as.anonymous.get(url(boilerId))).status).toBe(401);
    expect((await as.homeowner.get(url(boilerId))).status).toBe(403);
    expect((await as.homeowner.post(url(boilerId)).send({ kind: 'added_by_hand', recordedOn: '2026-03-21' })).status).toBe(403);
    expect((await as.manager.get(url(otherBoilerId))).status).toBe(404);
    expect((await as.manager.post(url(otherBoilerId)).send({ kind: 'added_by_hand', recordedOn: '2026-03-21' })).status).toBe(404);
    expect(await ctx.db.select().from(makeupWaterEntries).where(eq(makeupWaterEntries.applianceId, otherBoilerId))).toHaveLength(0);
  });

  it('dates a reading made today at the moment it is recorded, never ahead of it, and refuses a date after today', async () => {
    const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
    const fresh = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id })).id;
    const before = Date.now();
    const res = await as.technician.post(url(fresh)).send({ kind: 'meter_reading', recordedOn: '2026-11-18', gallons: 40 });
    const after = Date.now();
    expect(res.status).toBe(201);
    const [event] = await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.applianceId, fresh), eq(timelineEvents.kind, 'makeup_water')));
    expect(event.occurredAt.getTime()).toBeGreaterThanOrEqual(before);
    expect(event.occurredAt.getTime()).toBeLessThanOrEqual(after);

    const tomorrow = await as.technician.post(url(fresh)).send({ kind: 'added_by_hand', recordedOn: '2026-11-19' });
    expect(tomorrow.status).toBe(400);
    expect(tomorrow.body.error.details).toEqual({ recordedOn: ['A reading cannot be dated in the future.'] });
    expect(await ctx.db.select().from(makeupWaterEntries).where(eq(makeupWaterEntries.applianceId, fresh))).toHaveLength(1);
  });
});

import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { companies } from '../../server/db/schema/index';
import { DEFAULT_BOOKING_MINUTES } from '../../shared/schemas/bookings';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
const storedMinutes = async () => (await ctx.db.select().from(companies).where(eq(companies.id, t.company.id)))[0].bookingMinutes;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  as = await agentsFor(app, t);
});
afterAll(() => ctx.pool.end());

describe('booking window lengths (company setting)', () => {
  it('answers every kind with the defaults until the company sets its own', async () => {
    const res = await as.manager.get('/api/company');
    expect(res.status).toBe(200);
    expect(res.body.bookingMinutes).toEqual(DEFAULT_BOOKING_MINUTES);
  });

  it('keeps the kinds not named when one kind is changed, and stores only what was set', async () => {
    await as.owner.patch('/api/company').send({ bookingMinutes: { steam_boiler: 150 } }).expect(200);
    const res = await as.owner.patch('/api/company').send({ bookingMinutes: { water_heater: 45 } });
    expect(res.status).toBe(200);
    expect(res.body.bookingMinutes).toEqual({ ...DEFAULT_BOOKING_MINUTES, steam_boiler: 150, water_heater: 45 });
    expect(await storedMinutes()).toEqual({ steam_boiler: 150, water_heater: 45 });
  });

  it('refuses a window shorter than 15 minutes, longer than a day or for an unknown kind, field by field, writing nothing', async () => {
    const before = await storedMinutes();
    const short = await as.owner.patch('/api/company').send({ bookingMinutes: { steam_boiler: 5 } });
    expect(short.status).toBe(400);
    expect(short.body.error.details).toHaveProperty(['bookingMinutes.steam_boiler']);
    const long = await as.owner.patch('/api/company').send({ bookingMinutes: { water_heater: 24 * 60 + 1 } });
    expect(long.status).toBe(400);
    const odd = await as.owner.patch('/api/company').send({ bookingMinutes: { kettle: 30 } });
    expect(odd.status).toBe(400);
    expect(JSON.stringify(odd.body.error.details)).toMatch(/appliance kind/);
    expect(await storedMinutes()).toEqual(before);
  });

  it('lets only owners and managers change it', async () => {
    expect((await as.technician.patch('/api/company').send({ bookingMinutes: { steam_boiler: 60 } })).status).toBe(403);
    expect((await as.anonymous.patch('/api/company').send({ bookingMinutes: { steam_boiler: 60 } })).status).toBe(401);
  });
});

import { and, eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, radiationSurveyRadiators, radiationSurveyRooms, radiationSurveys } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';
import { runFileAt } from '../support/clock';

const { app, ctx } = testApp();
runFileAt('2026-11-18T12:00:00-05:00');
let t: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let steamId: string;
let waterId: string;
let furnaceId: string;
let otherBoilerId: string;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  const other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
  steamId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'steam_boiler', inputBtuh: 150_000, grossOutputBtuh: 120_000 })).id;
  waterId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'hot_water_boiler' })).id;
  furnaceId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'furnace' })).id;
  const otherSite = await insertSite(ctx.db, { companyId: other.company.id, customerId: other.customer.id });
  otherBoilerId = (await insertAppliance(ctx.db, { companyId: other.company.id, siteId: otherSite.id, kind: 'steam_boiler' })).id;
});
afterAll(() => ctx.pool.end());

const url = (id: string) => `/api/appliances/${id}/radiation-surveys`;
const storedSurveys = (applianceId: string) => ctx.db.select().from(radiationSurveys).where(eq(radiationSurveys.applianceId, applianceId));

const steamSurvey = {
  surveyedOn: '2026-11-17',
  system: 'steam',
  notes: 'One-pipe steam, all valves open',
  rooms: [
    {
      name: 'Parlour',
      radiators: [
        { type: 'cast_iron_column', columns: 3, heightIn: 38, sections: 10 },
        { type: 'tube', tubes: 4, heightIn: 32, sections: 8, count: 2 },
      ],
    },
    { name: 'Back bedroom', radiators: [{ type: 'wall', size: '9-A', sections: 3 }] },
  ],
};

describe('radiation survey', () => {
  it('stores a steam survey room by room and answers the totals and the sizes that suit it', async () => {
    const res = await as.technician.post(url(steamId)).send(steamSurvey);
    expect(res.status).toBe(201);
    // from memory: Holohan, "The Lost Art of Steam Heating": 3-column 38 in = 5 sq ft per section (10 → 50);
    // 4-tube 32 in = 3.5 sq ft per section (8 sections, two of them → 56); a 9-A wall section is 9 sq ft (3 → 27).
    expect(res.body.rooms.map((r: { name: string; edrSqFt: number }) => [r.name, r.edrSqFt])).toEqual([
      ['Parlour', 106],
      ['Back bedroom', 27],
    ]);
    expect(res.body.totalEdrSqFt).toBe(133);
    // Source: ASHRAE Handbook, HVAC Systems and Equipment: 1 sq ft EDR of steam = 240 Btu/h → 133 × 240 = 31,920.
    expect(res.body.sizing.btuhPerSqFtEdr).toBe(240);
    expect(res.body.sizing.netLoadBtuh).toBe(31_920);
    // from memory: I=B=R net ratings assume a 1.333 piping and pickup factor for steam → 42,549 gross.
    expect(res.body.sizing.grossOutputBtuh).toBe(42_549);
    // common practice: net rating from the load to a quarter above it.
    expect(res.body.sizing.suitableNetRatingBtuh).toEqual({ min: 31_920, max: 39_900 });
    expect(res.body.nameplate).toEqual({ inputBtuh: 150_000, grossOutputBtuh: 120_000 });
    expect(res.body.surveyedBy).toBe(t.technician.user.name);

    const [stored] = await storedSurveys(steamId);
    expect(stored).toMatchObject({ companyId: t.company.id, system: 'steam', designWaterF: null, totalEdrSqFt: 133, surveyedOn: '2026-11-17', surveyedBy: t.technician.user.id, notes: 'One-pipe steam, all valves open' });
    const rooms = await ctx.db.select().from(radiationSurveyRooms).where(eq(radiationSurveyRooms.surveyId, stored!.id));
    expect(rooms.map((r) => [r.position, r.name]).sort()).toEqual([[0, 'Parlour'], [1, 'Back bedroom']]);
    const radiators = await ctx.db.select().from(radiationSurveyRadiators).where(inArray(radiationSurveyRadiators.roomId, rooms.map((r) => r.id)));
    expect(radiators.map((r) => [r.type, r.edrSqFt, r.count]).sort()).toEqual([
      ['cast_iron_column', 50, 1],
      ['tube', 56, 2],
      ['wall', 27, 1],
    ]);
    expect(radiators.find((r) => r.type === 'wall')).toMatchObject({ wallSize: '9-A', sections: 3, columns: null, heightIn: null });
    const audit = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entity, 'radiation_survey'), eq(auditLog.entityId, stored!.id)));
    expect(audit).toHaveLength(1);
  });

  it('reads the latest survey back with the same totals, and lists every survey newest first', async () => {
    const latest = await as.manager.get(`${url(steamId)}/latest`);
    expect(latest.status).toBe(200);
    expect(latest.body.survey.totalEdrSqFt).toBe(133);
    expect(latest.body.survey.rooms[0].radiators[1]).toMatchObject({ type: 'tube', tubes: 4, heightIn: 32, sections: 8, count: 2, edrSqFt: 56 });

    const again = await as.manager.post(url(steamId)).send({ ...steamSurvey, surveyedOn: '2026-11-18', rooms: [steamSurvey.rooms[1]] });
    expect(again.status).toBe(201);
    expect(again.body.totalEdrSqFt).toBe(27);
    const list = await as.technician.get(url(steamId));
    expect(list.status).toBe(200);
    expect(list.body.map((s: { surveyedOn: string; totalEdrSqFt: number }) => [s.surveyedOn, s.totalEdrSqFt])).toEqual([
      ['2026-11-18', 27],
      ['2026-11-17', 133],
    ]);
    expect((await as.technician.get(`${url(steamId)}/latest`)).body.survey.totalEdrSqFt).toBe(27);
  });

  it('sizes hot water at the rate for the design water temperature', async () => {
    const res = await as.technician
      .post(url(waterId))
      .send({ surveyedOn: '2026-11-18', system: 'hot_water', designWaterF: 170, rooms: [{ name: 'Hall', radiators: [{ type: 'convector', ratedEdrSqFt: 200, count: 2 }] }] });
    expect(res.status).toBe(201);
    // from memory: I=B=R: 150 Btu/h per sq ft EDR at 170 °F average water; net ratings assume a 1.15 factor for water.
    expect(res.body.sizing).toMatchObject({ totalEdrSqFt: 400, btuhPerSqFtEdr: 150, netLoadBtuh: 60_000, grossOutputBtuh: 69_000 });
    const [stored] = await storedSurveys(waterId);
    expect(stored).toMatchObject({ system: 'hot_water', designWaterF: 170, totalEdrSqFt: 400 });
  });

  it('answers { survey: null } before the first survey', async () => {
    const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
    const fresh = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'steam_boiler' });
    const res = await as.technician.get(`${url(fresh.id)}/latest`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ survey: null });
  });

  it.each([
    ['no rooms', { ...steamSurvey, rooms: [] }, 'rooms'],
    [
      'zero sections in the third room',
      { ...steamSurvey, rooms: [...steamSurvey.rooms, { name: 'Attic', radiators: [{ type: 'cast_iron_column', columns: 2, heightIn: 26, sections: 0 }] }] },
      'rooms.2.radiators.0.sections',
    ],
    ['a height not in the table', { ...steamSurvey, rooms: [{ name: 'Den', radiators: [{ type: 'cast_iron_column', columns: 3, heightIn: 50, sections: 10 }] }] }, 'rooms.0.radiators.0.heightIn'],
    ['an absurd convector', { ...steamSurvey, rooms: [{ name: 'Den', radiators: [{ type: 'convector', ratedEdrSqFt: 90_000 }] }] }, 'rooms.0.radiators.0.ratedEdrSqFt'],
    ['a room with no radiators', { ...steamSurvey, rooms: [{ name: 'Hall', radiators: [] }] }, 'rooms.0.radiators'],
    ['hot water without its design temperature', { ...steamSurvey, system: 'hot_water' }, 'designWaterF'],
    ['a survey dated tomorrow', { ...steamSurvey, surveyedOn: '2026-11-19' }, 'surveyedOn'],
  ])('refuses %s with a field error and stores nothing', async (_what, body, field) => {
    const before = (await storedSurveys(steamId)).length;
    const res = await as.technician.post(url(steamId)).send(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details)).toEqual([field]);
    expect(await storedSurveys(steamId)).toHaveLength(before);
  });

  it('refuses a survey of a furnace (409), stores nothing', async () => {
    const res = await as.technician.post(url(furnaceId)).send(steamSurvey);
    expect(res.status).toBe(409);
    expect(await storedSurveys(furnaceId)).toHaveLength(0);
  });

  it('401 signed out, 403 for a homeowner, 404 for another company’s boiler', async () => {
    expect((await as.anonymous.get(url(steamId))).status).toBe(401);
    expect((await as.anonymous.post(url(steamId)).send(steamSurvey)).status).toBe(401);
    expect((await as.homeowner.get(`${url(steamId)}/latest`)).status).toBe(403);
    expect((await as.homeowner.post(url(steamId)).send(steamSurvey)).status).toBe(403);
    expect((await as.manager.get(`${url(otherBoilerId)}/latest`)).status).toBe(404);
    expect((await as.technician.post(url(otherBoilerId)).send(steamSurvey)).status).toBe(404);
    expect(await storedSurveys(otherBoilerId)).toHaveLength(0);
  });
});

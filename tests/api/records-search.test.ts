import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
const ids: Record<string, string> = {};
// A tag unique to this run, so parallel files and earlier runs never match.
const tag = `Zq${Date.now().toString(36)}`;

type Hit = { applianceId: string; matched: string; customerName: string; street: string; serial: string | null };

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  const c1 = await insertCustomer(ctx.db, { companyId: t.company.id, name: `Hester ${tag}ington`, phone: '(555) 014-2271' });
  const s1 = await insertSite(ctx.db, { companyId: t.company.id, customerId: c1.id, street: `17 ${tag} Lane`, town: 'Wrenfield' });
  ids.current = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: s1.id, serial: `${tag.toUpperCase()}-SER-1` })).id;
  ids.removed = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: s1.id, serial: 'OLD-1', status: 'removed', installedOn: '1980-01-01' })).id;
  const c2 = await insertCustomer(ctx.db, { companyId: t.company.id, name: 'Bram Ollerton', phone: '555-0199' });
  const s2 = await insertSite(ctx.db, { companyId: t.company.id, customerId: c2.id, street: `${tag} Court 3`, town: 'Ashby Hollow' });
  ids.second = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: s2.id, serial: 'BO-77' })).id;

  const oc = await insertCustomer(ctx.db, { companyId: other.company.id, name: `Hester ${tag}ington`, phone: '(555) 014-2271' });
  const os = await insertSite(ctx.db, { companyId: other.company.id, customerId: oc.id, street: `17 ${tag} Lane` });
  ids.foreign = (await insertAppliance(ctx.db, { companyId: other.company.id, siteId: os.id, serial: `${tag.toUpperCase()}-SER-1` })).id;
});
afterAll(() => ctx.pool.end());

const search = async (q: string): Promise<Hit[]> => {
  const res = await as.technician.get('/api/search').query({ q });
  expect(res.status).toBe(200);
  return res.body;
};

describe('GET /search', () => {
  it('finds by customer name, one hit per appliance, removed ones last', async () => {
    const hits = await search(`hester ${tag.toLowerCase()}`);
    expect(hits.map((h) => h.applianceId)).toEqual([ids.current, ids.removed]);
    expect(hits[0]).toMatchObject({ matched: 'name', customerName: `Hester ${tag}ington`, street: `17 ${tag} Lane` });
  });

  it('finds by street prefix and ranks prefix matches first', async () => {
    const hits = await search(`${tag} Co`);
    expect(hits.map((h) => h.applianceId)).toEqual([ids.second]);
    expect(hits[0].matched).toBe('street');
    const both = await search(tag);
    expect(both[0].applianceId).toBe(ids.second);
    expect(both.at(-1)!.applianceId).toBe(ids.removed);
    expect(new Set(both.map((h) => h.applianceId)).size).toBe(both.length);
  });

  it('finds by phone, however it is written', async () => {
    expect((await search('5550142271')).map((h) => h.applianceId).sort()).toEqual([ids.current, ids.removed].sort());
    expect((await search('014-22')).every((h) => h.matched === 'phone')).toBe(true);
  });

  it('finds by serial', async () => {
    const hits = await search(`${tag.toLowerCase()}-ser`);
    expect(hits).toEqual([expect.objectContaining({ applianceId: ids.current, matched: 'serial', serial: `${tag.toUpperCase()}-SER-1` })]);
  });

  it('never returns another company’s appliance', async () => {
    for (const q of [tag, `${tag}-SER-1`, '5550142271', `17 ${tag}`]) {
      expect((await search(q)).map((h) => h.applianceId)).not.toContain(ids.foreign);
    }
  });

  it('treats % and _ as plain characters', async () => {
    expect(await search('%%')).toEqual([]);
    expect(await search('__')).toEqual([]);
  });

  it('asks for at least two characters; 401 signed out; 403 for a homeowner', async () => {
    const res = await as.technician.get('/api/search').query({ q: 'a' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.q).toEqual(['Type at least 2 characters.']);
    expect((await as.anonymous.get('/api/search').query({ q: tag })).status).toBe(401);
    expect((await as.homeowner.get('/api/search').query({ q: tag })).status).toBe(403);
  });
});

import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, customers, sites } from '../../server/db/schema/index';
import { insertCustomer, insertSite } from '../../server/db/factories/records';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
});
afterAll(() => ctx.pool.end());

describe('POST /customers', () => {
  it('creates a customer for a technician and stores it with an audit row', async () => {
    const res = await as.technician.post('/api/customers').send({ name: '  Ida Fernhollow ', phone: '555-0311', email: 'IDA@Example.TEST', kind: 'landlord' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: 'Ida Fernhollow', phone: '555-0311', email: 'ida@example.test', kind: 'landlord', remindersOptOut: false, notes: null });
    const [row] = await ctx.db.select().from(customers).where(eq(customers.id, res.body.id));
    expect(row).toMatchObject({ companyId: t.company.id, name: 'Ida Fernhollow', kind: 'landlord', createdBy: t.technician.user.id });
    const audits = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entity, 'customer'), eq(auditLog.entityId, res.body.id)));
    expect(audits.map((a) => a.action)).toEqual(['create']);
  });

  it('answers bad input with field-level errors and stores nothing', async () => {
    const before = await ctx.db.select().from(customers).where(eq(customers.companyId, t.company.id));
    const res = await as.manager.post('/api/customers').send({ name: ' ', email: 'not-an-email', kind: 'tenant' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details).sort()).toEqual(['email', 'kind', 'name']);
    expect(res.body.error.details.name).toEqual(['Name is required.']);
    expect(await ctx.db.select().from(customers).where(eq(customers.companyId, t.company.id))).toHaveLength(before.length);
  });

  it('refuses signed-out callers with 401 and homeowners with 403', async () => {
    expect((await as.anonymous.post('/api/customers').send({ name: 'X' })).status).toBe(401);
    expect((await as.homeowner.post('/api/customers').send({ name: 'X' })).status).toBe(403);
    expect((await as.homeowner.get('/api/customers')).status).toBe(403);
    expect((await as.homeowner.get(`/api/customers/${t.customer.id}`)).status).toBe(403);
    expect((await as.homeowner.patch(`/api/customers/${t.customer.id}`).send({ name: 'X' })).status).toBe(403);
  });
});

describe('GET /customers/:id and PATCH /customers/:id', () => {
  it('shows the customer with sites and appliances', async () => {
    const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id, street: '4 Quarry Lane', town: 'Wrenfield' });
    const res = await as.owner.get(`/api/customers/${t.customer.id}`);
    expect(res.status).toBe(200);
    expect(res.body.id).toBe(t.customer.id);
    expect(res.body.sites.find((s: { id: string }) => s.id === site.id)).toMatchObject({ street: '4 Quarry Lane', town: 'Wrenfield', appliances: [] });
  });

  it('changes only the named fields', async () => {
    const c = await insertCustomer(ctx.db, { companyId: t.company.id, kind: 'landlord', remindersOptOut: true });
    const res = await as.technician.patch(`/api/customers/${c.id}`).send({ notes: 'Dog in the yard' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ notes: 'Dog in the yard', kind: 'landlord', remindersOptOut: true });
    const [row] = await ctx.db.select().from(customers).where(eq(customers.id, c.id));
    expect(row).toMatchObject({ notes: 'Dog in the yard', kind: 'landlord', remindersOptOut: true, name: c.name });
  });

  it('answers 404 for another company’s customer and leaves it alone', async () => {
    expect((await as.owner.get(`/api/customers/${other.customer.id}`)).status).toBe(404);
    expect((await as.owner.patch(`/api/customers/${other.customer.id}`).send({ name: 'Taken' })).status).toBe(404);
    const [row] = await ctx.db.select().from(customers).where(eq(customers.id, other.customer.id));
    expect(row.name).toBe(other.customer.name);
  });

  it('answers a bad id with a field error', async () => {
    const res = await as.owner.get('/api/customers/not-a-uuid');
    expect(res.status).toBe(400);
    expect(res.body.error.details.id).toBeDefined();
  });
});

describe('GET /customers (keyset paging)', () => {
  let fresh: Tenant;
  let agents: Awaited<ReturnType<typeof agentsFor>>;
  beforeAll(async () => {
    fresh = await createTenant(ctx.db);
    agents = await agentsFor(app, fresh);
    const towns = ['Ashby Hollow', 'Wrenfield', 'East Wrenfield', 'Millbrook Crossing'];
    for (let i = 0; i < 11; i++) {
      const c = await insertCustomer(ctx.db, { companyId: fresh.company.id, name: `Pagecustomer ${String(i).padStart(2, '0')}`, phone: `555-77${String(i).padStart(2, '0')}` });
      if (i % 3 !== 0) await insertSite(ctx.db, { companyId: fresh.company.id, customerId: c.id, town: towns[i % 4] });
    }
  });

  async function allPages(sort: string, limit: number) {
    const pages: { id: string; name: string; firstTown: string | null }[][] = [];
    let after: string | null = null;
    do {
      const query: Record<string, string | number> = { sort, limit };
      if (after) query.after = after;
      const res = await agents.manager.get('/api/customers').query(query);
      expect(res.status).toBe(200);
      pages.push(res.body.items);
      after = res.body.nextCursor;
    } while (after && pages.length < 20);
    return pages;
  }

  it('pages by name without gaps or repeats, in order', async () => {
    const pages = await allPages('name', 4);
    const names = pages.flat().map((c) => c.name);
    expect(pages.length).toBeGreaterThanOrEqual(3);
    expect(new Set(pages.flat().map((c) => c.id)).size).toBe(names.length);
    const [rows] = [await ctx.db.select().from(customers).where(eq(customers.companyId, fresh.company.id))];
    expect(names).toHaveLength(rows.length);
    expect(names.filter((n) => n.startsWith('Pagecustomer'))).toEqual(Array.from({ length: 11 }, (_, i) => `Pagecustomer ${String(i).padStart(2, '0')}`));
  });

  it('pages by town with customers without a site last', async () => {
    const items = (await allPages('town', 3)).flat();
    const towns = items.map((c) => c.firstTown);
    const firstNull = towns.indexOf(null);
    expect(firstNull).toBeGreaterThan(0);
    expect(towns.slice(firstNull).every((x) => x === null)).toBe(true);
    const named = towns.slice(0, firstNull) as string[];
    expect(named).toEqual([...named].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)));
  });

  it('pages by newest first', async () => {
    const items = (await allPages('created', 5)).flat();
    expect(items[0].name).toBe('Pagecustomer 10');
    expect(new Set(items.map((c) => c.id)).size).toBe(items.length);
  });

  it('filters by q and counts sites', async () => {
    const res = await agents.manager.get('/api/customers').query({ q: 'pagecustomer 0' });
    expect(res.body.items.map((c: { name: string }) => c.name)).toHaveLength(10);
    const one = await agents.manager.get('/api/customers').query({ q: '555-7701' });
    expect(one.body.items).toEqual([expect.objectContaining({ name: 'Pagecustomer 01', siteCount: 1, applianceCount: 0 })]);
  });

  it('rejects a cursor from another sort with a field error', async () => {
    const first = await agents.manager.get('/api/customers').query({ sort: 'name', limit: 2 });
    const res = await agents.manager.get('/api/customers').query({ sort: 'town', after: first.body.nextCursor });
    expect(res.status).toBe(400);
    expect(res.body.error.details.after).toBeDefined();
    const bad = await agents.manager.get('/api/customers').query({ sort: 'sideways', limit: 0 });
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['limit', 'sort']);
  });

  it('never lists another company’s customers', async () => {
    const res = await agents.owner.get('/api/customers').query({ limit: 100 });
    const ids = res.body.items.map((c: { id: string }) => c.id);
    expect(ids).not.toContain(t.customer.id);
    expect(ids).toContain(fresh.customer.id);
  });
});

describe('sites', () => {
  it('creates a site with an assigned technician; the stored row and audit follow', async () => {
    const res = await as.technician.post('/api/sites').send({
      customerId: t.customer.id,
      street: '12 Tanner Row',
      town: 'Wrenfield',
      assignedTechnicianId: t.technician.user.id,
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ street: '12 Tanner Row', assignedTechnicianId: t.technician.user.id, assignedTechnicianName: t.technician.user.name });
    const [row] = await ctx.db.select().from(sites).where(eq(sites.id, res.body.id));
    expect(row).toMatchObject({ companyId: t.company.id, customerId: t.customer.id, street: '12 Tanner Row' });
    const audits = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entity, 'site'), eq(auditLog.entityId, res.body.id)));
    expect(audits).toHaveLength(1);
  });

  it("records the site's elevation for the altitude derate, and refuses one outside the derate rule's range", async () => {
    const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
    const res = await as.technician.patch(`/api/sites/${site.id}`).send({ elevationFt: 5280 });
    expect(res.status).toBe(200);
    expect(res.body.elevationFt).toBe(5280);
    expect((await ctx.db.select().from(sites).where(eq(sites.id, site.id)))[0].elevationFt).toBe(5280);
    for (const elevationFt of [20_000, -5000, 12.5, 'high']) {
      const bad = await as.technician.patch(`/api/sites/${site.id}`).send({ elevationFt });
      expect(bad.status).toBe(400);
      expect(Object.keys(bad.body.error.details)).toEqual(['elevationFt']);
    }
    const cleared = await as.technician.patch(`/api/sites/${site.id}`).send({ elevationFt: null });
    expect(cleared.body.elevationFt).toBeNull();
    expect((await ctx.db.select().from(sites).where(eq(sites.id, site.id)))[0].elevationFt).toBeNull();
  });

  it('refuses a technician of another company and a customer of another company, with field errors', async () => {
    const wrongTech = await as.manager.post('/api/sites').send({ customerId: t.customer.id, street: '1 A St', town: 'Wrenfield', assignedTechnicianId: other.technician.user.id });
    expect(wrongTech.status).toBe(400);
    expect(wrongTech.body.error.details.assignedTechnicianId).toBeDefined();
    const wrongCustomer = await as.manager.post('/api/sites').send({ customerId: other.customer.id, street: '1 A St', town: 'Wrenfield' });
    expect(wrongCustomer.status).toBe(400);
    expect(wrongCustomer.body.error.details.customerId).toBeDefined();
    const missing = await as.manager.post('/api/sites').send({ customerId: 'x', street: '', town: '' });
    expect(Object.keys(missing.body.error.details).sort()).toEqual(['customerId', 'street', 'town']);
    expect(await ctx.db.select().from(sites).where(eq(sites.street, '1 A St'))).toHaveLength(0);
  });

  it('updates a site; another company’s site is 404; homeowner 403; signed out 401', async () => {
    const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
    const res = await as.technician.patch(`/api/sites/${site.id}`).send({ accessNotes: 'Key under the mat', assignedTechnicianId: t.manager.user.id });
    expect(res.status).toBe(200);
    const [row] = await ctx.db.select().from(sites).where(eq(sites.id, site.id));
    expect(row).toMatchObject({ accessNotes: 'Key under the mat', assignedTechnicianId: t.manager.user.id, street: site.street });
    const bad = await as.technician.patch(`/api/sites/${site.id}`).send({ assignedTechnicianId: other.owner.user.id });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.assignedTechnicianId).toBeDefined();

    const otherSite = await insertSite(ctx.db, { companyId: other.company.id, customerId: other.customer.id });
    expect((await as.owner.patch(`/api/sites/${otherSite.id}`).send({ town: 'Elsewhere' })).status).toBe(404);
    expect((await as.homeowner.patch(`/api/sites/${site.id}`).send({ town: 'Elsewhere' })).status).toBe(403);
    expect((await as.homeowner.post('/api/sites').send({ customerId: t.customer.id, street: 'x', town: 'y' })).status).toBe(403);
    expect((await as.anonymous.patch(`/api/sites/${site.id}`).send({ town: 'Elsewhere' })).status).toBe(401);
  });
});

import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, components, customers, sites, users, visits } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import { UNSTORABLE_TEXT_MESSAGE } from '../../shared/schemas/common';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';
import { uniqueEmail } from '../support/outbox';

const { app, ctx } = testApp();
let t: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let siteId: string;
let visitId: string;
let componentId: string;

const NUL = 'a\u0000b';
const LONE_HIGH = '\ud800 x';
const LONE_LOW = 'x \udc00';

beforeAll(async () => {
  t = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id, accessNotes: 'Key under the mat' });
  siteId = site.id;
  const boiler = await insertAppliance(ctx.db, { companyId: t.company.id, siteId, components: [{ typeCode: 'thermocouple', installedOn: '2020-01-01' }] });
  componentId = boiler.components[0].id;
  const visit = await as.technician.post('/api/visits').send({ applianceId: boiler.id, type: 'repair' });
  expect(visit.status).toBe(200);
  visitId = visit.body.id;
});
afterAll(() => ctx.pool.end());

const countOf = async (table: typeof customers | typeof auditLog | typeof components) =>
  (await ctx.db.select().from(table).where(eq(table.companyId, t.company.id))).length;

describe('text PostgreSQL cannot store', () => {
  it.each([
    ['a NUL', NUL],
    ['a lone high surrogate', LONE_HIGH],
    ['a lone low surrogate', LONE_LOW],
  ])('refuses %s in a new customer’s name and notes field by field, and writes nothing', async (_what, bad) => {
    const [customersBefore, auditBefore] = [await countOf(customers), await countOf(auditLog)];
    const res = await as.manager.post('/api/customers').send({ name: bad, notes: `Gate code 14${bad}` });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual({ name: [UNSTORABLE_TEXT_MESSAGE], notes: [UNSTORABLE_TEXT_MESSAGE] });
    expect(await countOf(customers)).toBe(customersBefore);
    expect(await countOf(auditLog)).toBe(auditBefore);
  });

  it('keeps an emoji, which is a surrogate pair and storable, as it was sent', async () => {
    const res = await as.manager.post('/api/customers').send({ name: 'Wren Hollow 🔥', notes: 'Dog 🐕 in the yard' });
    expect(res.status).toBe(201);
    const [row] = await ctx.db.select().from(customers).where(eq(customers.id, res.body.id));
    expect(row).toMatchObject({ name: 'Wren Hollow 🔥', notes: 'Dog 🐕 in the yard' });
  });

  it('refuses it in a site’s access notes and leaves the site as it was', async () => {
    const res = await as.technician.patch(`/api/sites/${siteId}`).send({ accessNotes: NUL });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual({ accessNotes: [UNSTORABLE_TEXT_MESSAGE] });
    const [row] = await ctx.db.select().from(sites).where(eq(sites.id, siteId));
    expect(row.accessNotes).toBe('Key under the mat');
  });

  it('refuses it in a visit’s findings and in a checklist note nested in the draft', async () => {
    const res = await as.technician
      .put(`/api/visits/${visitId}/draft`)
      .send({ revision: 0, findings: LONE_HIGH, checklist: [{ key: 'burners', mark: 'done', note: NUL }] });
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual({ findings: [UNSTORABLE_TEXT_MESSAGE], 'checklist.0.note': [UNSTORABLE_TEXT_MESSAGE] });
    const [row] = await ctx.db.select().from(visits).where(eq(visits.id, visitId));
    expect(row).toMatchObject({ findings: '', revision: 0 });
  });

  it('refuses it in a part swap’s free-form spec, as a value and as a key (named by its record, not by the key)', async () => {
    const partsBefore = await countOf(components);
    const asValue = await as.technician.post(`/api/visits/${visitId}/swaps`).send({ componentId, newSpec: { size: `24 in${NUL}` } });
    expect(asValue.status).toBe(400);
    expect(asValue.body.error.details).toEqual({ 'newSpec.size': [UNSTORABLE_TEXT_MESSAGE] });
    const asKey = await as.technician.post(`/api/visits/${visitId}/swaps`).send({ componentId, newSpec: { [`size${NUL}`]: 24 } });
    expect(asKey.status).toBe(400);
    expect(asKey.body.error.details).toEqual({ newSpec: [UNSTORABLE_TEXT_MESSAGE] });
    expect(await countOf(components)).toBe(partsBefore);
  });

  it('refuses a NUL in query text (search, the customer list filter) with 400, not a failed query', async () => {
    const search = await as.technician.get('/api/search').query({ q: `Wren${NUL}` });
    expect(search.status).toBe(400);
    expect(search.body.error.details).toEqual({ q: [UNSTORABLE_TEXT_MESSAGE] });
    const list = await as.technician.get('/api/customers').query({ q: NUL });
    expect(list.status).toBe(400);
    expect(list.body.error.details).toEqual({ q: [UNSTORABLE_TEXT_MESSAGE] });
  });
});

describe('better-auth’s own endpoints', () => {
  it('refuse a NUL in the name on update-user with 400 and keep the stored name', async () => {
    const res = await as.owner.post('/api/auth/update-user').send({ name: NUL });
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ code: 'UNSTORABLE_TEXT', message: UNSTORABLE_TEXT_MESSAGE, fields: ['name'] });
    const [row] = await ctx.db.select().from(users).where(eq(users.id, t.owner.user.id));
    expect(row.name).toBe(t.owner.user.name);
  });

  it('refuse sign-up with a lone surrogate in the name, creating no account', async () => {
    const email = uniqueEmail();
    const res = await request(app).post('/api/auth/sign-up/email').send({ email, name: LONE_LOW, password: DEFAULT_TEST_PASSWORD });
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('UNSTORABLE_TEXT');
    expect(await ctx.db.select().from(users).where(eq(users.email, email))).toEqual([]);
  });

  it('answer a NUL in the sign-in e-mail with 400, and still sign in with a clean one', async () => {
    const bad = await request(app).post('/api/auth/sign-in/email').send({ email: `${t.owner.user.email}${'\u0000'}`, password: DEFAULT_TEST_PASSWORD });
    expect(bad.status).toBe(400);
    const good = await request(app).post('/api/auth/sign-in/email').send({ email: t.owner.user.email, password: DEFAULT_TEST_PASSWORD });
    expect(good.status).toBe(200);
  });
});

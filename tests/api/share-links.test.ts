import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { shareLinks, visits } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let boilerId: string;
let otherBoilerId: string;
const SECRET_NOTE = 'Office only: customer owes for the last call';

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id, street: '12 Quarry Lane', town: 'Wrenfield' });
  boilerId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id })).id;
  const otherSite = await insertSite(ctx.db, { companyId: other.company.id, customerId: other.customer.id });
  otherBoilerId = (await insertAppliance(ctx.db, { companyId: other.company.id, siteId: otherSite.id })).id;
  // A completed visit with an internal note that must never reach the homeowner.
  await ctx.db.insert(visits).values({
    companyId: t.company.id,
    applianceId: boilerId,
    type: 'annual_maintenance',
    status: 'completed',
    visitedOn: '2026-10-15',
    findings: 'Cleaned the burners.',
    internalNotes: SECRET_NOTE,
    outcome: 'left_operating',
    completedAt: new Date('2026-10-15T15:00:00Z'),
    checklist: [{ key: 'burners', section: 'Burner and pilot', label: 'Clean the burners', mark: 'done', note: 'tech-only remark' }],
    results: { combustion: { efficiencyPct: 81.2, coAirFreePpm: 40 } },
  });
});
afterAll(() => ctx.pool.end());

const tokenOf = (url: string) => url.split('/s/')[1];

describe('share links', () => {
  it('makes a link with a 256-bit token, keeps only its hash, and opens the plain-words view', async () => {
    const before = Date.now();
    const res = await as.technician.post(`/api/appliances/${boilerId}/share-links`).send({ label: 'for the owner' });
    const after = Date.now();
    expect(res.status).toBe(201);
    expect(res.body.url).toMatch(/^http:\/\/127\.0\.0\.1:3999\/s\/[A-Za-z0-9_-]{43}$/);
    expect(res.body.status).toBe('active');
    // One year by default, from the moment the request was handled, however long it took.
    const year = 365 * 86_400_000;
    expect(Date.parse(res.body.expiresAt)).toBeGreaterThanOrEqual(before + year);
    expect(Date.parse(res.body.expiresAt)).toBeLessThanOrEqual(after + year);
    const [row] = await ctx.db.select().from(shareLinks).where(eq(shareLinks.id, res.body.id));
    expect(row.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(row.tokenHash).not.toContain(tokenOf(res.body.url));

    const view = await as.anonymous.get(`/api/share/${tokenOf(res.body.url)}`);
    expect(view.status).toBe(200);
    expect(view.headers['x-robots-tag']).toBe('noindex, nofollow');
    expect(view.headers['referrer-policy']).toBe('no-referrer');
    expect(view.body.appliance.address).toBe('12 Quarry Lane, Wrenfield');
    expect(view.body.visits[0]).toMatchObject({ what: 'Annual maintenance', checked: ['Burner and pilot'], outcomeWords: 'Left operating' });
    expect(view.body.visits[0].readingsInWords[0]).toMatch(/about 81 %/);
    expect(view.body.nextAnnualServiceDue).toBe('2027-10-15');
    // Internal notes and technician-only fields never reach it.
    const text = JSON.stringify(view.body);
    for (const hidden of [SECRET_NOTE, 'tech-only remark', 'internalNotes', 'serial', t.customer.phone ?? '∅', t.customer.email ?? '∅']) {
      expect(text).not.toContain(hidden);
    }
  });

  it('answers 410 share_link_revoked once the company withdrew it, naming whom to ask and nothing about the appliance, and 404 for a token never issued', async () => {
    const made = await as.manager.post(`/api/appliances/${boilerId}/share-links`).send({});
    const token = tokenOf(made.body.url);
    expect((await as.technician.post(`/api/share-links/${made.body.id}/revoke`)).status).toBe(403);
    const revoked = await as.manager.post(`/api/share-links/${made.body.id}/revoke`);
    expect(revoked.body.status).toBe('revoked');
    const res = await as.anonymous.get(`/api/share/${token}`);
    expect(res.status).toBe(410);
    expect(res.body).toEqual({
      error: {
        code: 'share_link_revoked',
        message: `${t.company.name} withdrew this link, so the record is no longer shared through it. To see it again, ask ${t.company.name} for a new link: call ${t.company.phone}.`,
      },
    });
    expect((await as.anonymous.get(`/api/share/${'A'.repeat(43)}`)).status).toBe(404);
  });

  it('answers 410 share_link_expired once expired, told apart from a withdrawn link', async () => {
    const made = await as.manager.post(`/api/appliances/${boilerId}/share-links`).send({ expiresInDays: 1 });
    await ctx.db.update(shareLinks).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(shareLinks.id, made.body.id));
    const res = await as.anonymous.get(`/api/share/${tokenOf(made.body.url)}`);
    expect(res.status).toBe(410);
    expect(res.body).toEqual({
      error: { code: 'share_link_expired', message: `This link has expired. To see the record again, ask ${t.company.name} for a new link: call ${t.company.phone}.` },
    });
    const list = await as.manager.get(`/api/appliances/${boilerId}/share-links`);
    expect(list.body.find((l: { id: string }) => l.id === made.body.id).status).toBe('expired');
  });

  it('checks roles, tenants and input', async () => {
    expect((await as.anonymous.post(`/api/appliances/${boilerId}/share-links`).send({})).status).toBe(401);
    expect((await as.homeowner.post(`/api/appliances/${boilerId}/share-links`).send({})).status).toBe(403);
    expect((await as.manager.post(`/api/appliances/${otherBoilerId}/share-links`).send({})).status).toBe(404);
    const bad = await as.manager.post(`/api/appliances/${boilerId}/share-links`).send({ expiresInDays: 0 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details)).toEqual(['expiresInDays']);
    expect((await as.anonymous.get('/api/share/not-a-token')).status).toBe(400);
  });
});

describe('the homeowner’s own view', () => {
  it('lists only their own appliances and opens them; another appliance answers 404', async () => {
    const list = await as.homeowner.get('/api/homeowner/appliances');
    expect(list.status).toBe(200);
    expect(list.body.map((a: { id: string }) => a.id)).toEqual([boilerId]);
    const view = await as.homeowner.get(`/api/homeowner/appliances/${boilerId}`);
    expect(view.status).toBe(200);
    expect(JSON.stringify(view.body)).not.toContain(SECRET_NOTE);
    expect((await as.homeowner.get(`/api/homeowner/appliances/${otherBoilerId}`)).status).toBe(404);
    expect((await as.technician.get('/api/homeowner/appliances')).status).toBe(403);
  });
});

import crypto from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { simpleParser, type ParsedMail } from 'mailparser';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { readStoredMail } from '../../fakes/smtp';
import { auditLog, memberships, serviceRequests, shareLinks, timelineEvents } from '../../server/db/schema/index';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { insertHomeowner, insertMember } from '../../server/db/factories/users';
import { hashShareToken } from '../../server/modules/share-links/resolve-share-token';
import { testApp } from '../support/context';
import { freePort } from '../support/global-setup';
import { agentsFor, createTenant, signIn, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherAs: Awaited<ReturnType<typeof agentsFor>>;
let boilerId: string;
let neighbourBoilerId: string;
let otherBoilerId: string;
let retiredManagerEmail: string;

const tokenOf = (url: string) => url.split('/s/')[1];
const rowsFor = (applianceId: string) => ctx.db.select().from(serviceRequests).where(eq(serviceRequests.applianceId, applianceId));

async function newLink(applianceId = boilerId) {
  const res = await as.manager.post(`/api/appliances/${applianceId}/share-links`).send({});
  expect(res.status).toBe(201);
  return { id: res.body.id as string, token: tokenOf(res.body.url) };
}

/** Mail the fake SMTP server received for one address; other test files share the fake, so filter by recipient. */
async function mailTo(address: string): Promise<{ envelopeTo: string[]; parsed: ParsedMail }[]> {
  const mails = readStoredMail(inject('outboxDir')).filter((m) => m.to.includes(address.toLowerCase()));
  return Promise.all(mails.map(async (m) => ({ envelopeTo: m.to, parsed: await simpleParser(m.raw) })));
}

const request = { contactName: '  Maren Holloway ', contactPhone: '555-0142', contactEmail: 'maren.h@example.test', preferredTimes: 'Weekday mornings', message: 'Radiator in the hall stays cold.' };

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  [as, otherAs] = await Promise.all([agentsFor(app, t), agentsFor(app, other)]);
  const retired = await insertMember(ctx.db, { companyId: t.company.id, role: 'manager' });
  await ctx.db.update(memberships).set({ deactivatedAt: new Date() }).where(eq(memberships.id, retired.membership.id));
  retiredManagerEmail = retired.user.email;
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id, street: '4 Millrace Court', town: 'Wrenfield' });
  boilerId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'steam_boiler', fuel: 'natural_gas' })).id;
  const neighbour = await insertCustomer(ctx.db, { companyId: t.company.id });
  const neighbourSite = await insertSite(ctx.db, { companyId: t.company.id, customerId: neighbour.id });
  neighbourBoilerId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: neighbourSite.id })).id;
  const otherSite = await insertSite(ctx.db, { companyId: other.company.id, customerId: other.customer.id });
  otherBoilerId = (await insertAppliance(ctx.db, { companyId: other.company.id, siteId: otherSite.id })).id;
});
afterAll(() => ctx.pool.end());

describe('a service request through a share link', () => {
  let requestId: string;

  it('stores the request with a hidden timeline note and an audit row, and answers with the company to call', async () => {
    const link = await newLink();
    const res = await as.anonymous.post(`/api/share/${link.token}/service-requests`).send(request);
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ id: expect.any(String), company: { name: t.company.name, phone: t.company.phone } });
    requestId = res.body.id;

    const [row] = await ctx.db.select().from(serviceRequests).where(eq(serviceRequests.id, requestId));
    expect(row).toMatchObject({
      companyId: t.company.id,
      applianceId: boilerId,
      customerId: t.customer.id,
      via: 'share_link',
      shareLinkId: link.id,
      requesterUserId: null,
      contactName: 'Maren Holloway',
      contactPhone: '555-0142',
      contactEmail: 'maren.h@example.test',
      preferredTimes: 'Weekday mornings',
      message: 'Radiator in the hall stays cold.',
      status: 'new',
      handledBy: null,
    });
    expect(row.officeNotifiedAt).toBeInstanceOf(Date);

    const events = await ctx.db.select().from(timelineEvents).where(eq(timelineEvents.refId, requestId));
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ applianceId: boilerId, kind: 'note', homeownerVisible: false, summary: 'Service request from Maren Holloway through the share link' });
    const audit = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entity, 'service_request'), eq(auditLog.entityId, requestId)));
    expect(audit).toMatchObject([{ action: 'create', actorId: null, companyId: t.company.id }]);
  });

  it('e-mails the active owners and managers only, as text and HTML, with a link to the request in the office list', async () => {
    const toOwner = await mailTo(t.owner.user.email);
    expect(toOwner).toHaveLength(1);
    const [{ envelopeTo, parsed }] = toOwner;
    expect(envelopeTo.sort()).toEqual([t.owner.user.email, t.manager.user.email].map((e) => e.toLowerCase()).sort());
    for (const nobody of [t.technician.user.email, t.homeowner.user.email, retiredManagerEmail, other.owner.user.email, other.manager.user.email]) {
      expect(await mailTo(nobody)).toHaveLength(0);
    }
    expect(parsed.subject).toBe('Service request: 4 Millrace Court, Wrenfield');
    expect(parsed.replyTo?.value).toEqual([{ address: 'maren.h@example.test', name: '' }]);
    // So the development outbox shows it to this company only.
    expect(parsed.headers.get('x-lifeplate-company')).toBe(t.company.id);
    const link = `http://127.0.0.1:3999/service-requests?request=${requestId}`;
    expect(parsed.text).toContain('Name: Maren Holloway');
    expect(parsed.text).toContain('Phone: 555-0142');
    expect(parsed.text).toContain('Preferred times: Weekday mornings');
    expect(parsed.text).toContain('Appliance: Steam boiler, natural gas');
    expect(parsed.text).toContain('Radiator in the hall stays cold.');
    expect(parsed.text).toContain(link);
    expect(parsed.html).toContain(`href="${link}"`);
    expect(parsed.html).toContain('Radiator in the hall stays cold.');
    // The link's request is the one the office list shows.
    const listed = await as.manager.get('/api/service-requests');
    expect(listed.body.items.map((i: { id: string }) => i.id)).toContain(new URL(link).searchParams.get('request'));
  });

  it('names each missing field and stores nothing', async () => {
    const link = await newLink();
    const before = (await rowsFor(boilerId)).length;
    const empty = await as.anonymous.post(`/api/share/${link.token}/service-requests`).send({ contactName: '   ', contactPhone: '', contactEmail: '' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.code).toBe('validation_failed');
    expect(empty.body.error.details).toEqual({
      contactName: ['Your name is required.'],
      contactPhone: ['Give a phone number or an e-mail address, so the office can reach you.'],
    });
    const bad = await as.anonymous
      .post(`/api/share/${link.token}/service-requests`)
      .send({ contactName: 'Maren', contactPhone: '12', contactEmail: 'not-an-address', message: 'x'.repeat(2001) });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['contactEmail', 'contactPhone', 'message']);
    expect((await rowsFor(boilerId)).length).toBe(before);
  });

  it('answers 404 to a token never issued and 410 to a revoked or expired one, saying nothing of the appliance', async () => {
    const body = request;
    const unknown = await as.anonymous.post(`/api/share/${crypto.randomBytes(32).toString('base64url')}/service-requests`).send(body);
    expect(unknown.status).toBe(404);
    expect(unknown.body).toEqual({ error: { code: 'not_found', message: 'Share link not found.' } });

    const revoked = await newLink();
    expect((await as.manager.post(`/api/share-links/${revoked.id}/revoke`)).status).toBe(200);
    const afterRevoke = await as.anonymous.post(`/api/share/${revoked.token}/service-requests`).send(body);
    expect(afterRevoke.status).toBe(410);
    expect(afterRevoke.body.error.code).toBe('share_link_revoked');
    expect(afterRevoke.body.error.message).toContain(`${t.company.name} withdrew this link`);

    const expiredToken = crypto.randomBytes(32).toString('base64url');
    await ctx.db.insert(shareLinks).values({
      companyId: t.company.id,
      applianceId: boilerId,
      tokenHash: hashShareToken(expiredToken),
      expiresAt: new Date(Date.now() - 60_000),
      createdBy: t.manager.user.id,
    });
    const expired = await as.anonymous.post(`/api/share/${expiredToken}/service-requests`).send(body);
    expect(expired.status).toBe(410);
    expect(expired.body.error.code).toBe('share_link_expired');
    expect(expired.body.error.message).toContain('This link has expired.');
    const stored = await ctx.db.select().from(serviceRequests).where(eq(serviceRequests.shareLinkId, revoked.id));
    expect(stored).toHaveLength(0);
  });

  it('takes five requests a day through one link, then answers 429 and stores no more', async () => {
    const link = await newLink();
    for (let i = 0; i < 5; i++) {
      expect((await as.anonymous.post(`/api/share/${link.token}/service-requests`).send({ contactName: `Caller ${i}`, contactEmail: 'caller@example.test' })).status).toBe(201);
    }
    const sixth = await as.anonymous.post(`/api/share/${link.token}/service-requests`).send({ contactName: 'Caller 6', contactEmail: 'caller@example.test' });
    expect(sixth.status).toBe(429);
    expect(sixth.body.error.code).toBe('too_many_requests');
    expect(sixth.body.error.message).toContain(t.company.phone);
    expect(await ctx.db.select().from(serviceRequests).where(eq(serviceRequests.shareLinkId, link.id))).toHaveLength(5);
    // Another link for the same appliance is not held back by the first.
    const fresh = await newLink();
    expect((await as.anonymous.post(`/api/share/${fresh.token}/service-requests`).send({ contactName: 'Caller 7', contactPhone: '555-0199' })).status).toBe(201);
  });

  it('keeps the request and still answers 201 when the e-mail cannot be sent, leaving office_notified_at empty', async () => {
    const broken = testApp({ SMTP_PORT: String(await freePort()) });
    try {
      const viaBroken = await supertest(broken.app).post(`/api/share/${(await newLink()).token}/service-requests`).send({ contactName: 'Mail Down', contactPhone: '555-0101' });
      expect(viaBroken.status).toBe(201);
      const [row] = await ctx.db.select().from(serviceRequests).where(eq(serviceRequests.id, viaBroken.body.id));
      expect(row).toMatchObject({ contactName: 'Mail Down', status: 'new', officeNotifiedAt: null });
    } finally {
      broken.ctx.mailer.close();
      await broken.ctx.pool.end();
    }
  });
});

describe('a service request from the signed-in homeowner', () => {
  it('is stored for their own appliance, with them as the requester', async () => {
    const res = await as.homeowner.post(`/api/homeowner/appliances/${boilerId}/service-requests`).send({ contactName: 'Home Owner', contactPhone: '555-0177' });
    expect(res.status).toBe(201);
    const [row] = await ctx.db.select().from(serviceRequests).where(eq(serviceRequests.id, res.body.id));
    expect(row).toMatchObject({ via: 'homeowner_account', requesterUserId: t.homeowner.user.id, shareLinkId: null, applianceId: boilerId });
    const [event] = await ctx.db.select().from(timelineEvents).where(eq(timelineEvents.refId, res.body.id));
    expect(event).toMatchObject({ kind: 'note', homeownerVisible: false, actorId: t.homeowner.user.id });
  });

  it('takes five a day from one homeowner, then answers 429', async () => {
    const homeowner = await insertHomeowner(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
    const agent = await signIn(app, homeowner.user.email);
    const body = { contactName: 'Second Owner', contactEmail: 'second.owner@example.test' };
    for (let i = 0; i < 5; i++) expect((await agent.post(`/api/homeowner/appliances/${boilerId}/service-requests`).send(body)).status).toBe(201);
    const sixth = await agent.post(`/api/homeowner/appliances/${boilerId}/service-requests`).send(body);
    expect(sixth.status).toBe(429);
    expect(await ctx.db.select().from(serviceRequests).where(eq(serviceRequests.requesterUserId, homeowner.user.id))).toHaveLength(5);
  });

  it('answers 404 for a neighbour’s or another company’s appliance, 403 to a member, 401 signed out', async () => {
    const body = { contactName: 'Home Owner', contactPhone: '555-0177' };
    for (const id of [neighbourBoilerId, otherBoilerId, crypto.randomUUID()]) {
      const res = await as.homeowner.post(`/api/homeowner/appliances/${id}/service-requests`).send(body);
      expect(res.status).toBe(404);
    }
    expect(await rowsFor(neighbourBoilerId)).toHaveLength(0);
    expect(await rowsFor(otherBoilerId)).toHaveLength(0);
    expect((await as.manager.post(`/api/homeowner/appliances/${boilerId}/service-requests`).send(body)).status).toBe(403);
    expect((await as.anonymous.post(`/api/homeowner/appliances/${boilerId}/service-requests`).send(body)).status).toBe(401);
    const bad = await as.homeowner.post(`/api/homeowner/appliances/${boilerId}/service-requests`).send({ contactPhone: '555-0177' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details)).toEqual(['contactName']);
  });
});

describe('the office list', () => {
  it('shows only this company’s requests, newest first, filtered by status and paged by keyset', async () => {
    const mine = await rowsFor(boilerId);
    const all = await as.technician.get('/api/service-requests').query({ limit: 100 });
    expect(all.status).toBe(200);
    expect(all.body.items.map((i: { id: string }) => i.id).sort()).toEqual(mine.map((r) => r.id).sort());
    const times = all.body.items.map((i: { createdAt: string }) => i.createdAt);
    expect([...times].sort().reverse()).toEqual(times);
    expect(all.body.newCount).toBe(mine.length);
    expect(all.body.items[0].appliance).toEqual({ id: boilerId, title: 'Steam boiler, natural gas', address: '4 Millrace Court, Wrenfield' });

    const theirs = await otherAs.manager.get('/api/service-requests');
    expect(theirs.body).toEqual({ items: [], nextCursor: null, newCount: 0 });

    const seen: string[] = [];
    let after: string | undefined;
    do {
      const page = await as.manager.get('/api/service-requests').query({ limit: 3, ...(after ? { after } : {}) });
      expect(page.status).toBe(200);
      seen.push(...page.body.items.map((i: { id: string }) => i.id));
      after = page.body.nextCursor ?? undefined;
    } while (after);
    expect(seen).toEqual(all.body.items.map((i: { id: string }) => i.id));

    expect((await as.manager.get('/api/service-requests').query({ status: 'lost' })).status).toBe(400);
    expect((await as.manager.get('/api/service-requests').query({ after: 'garbage' })).body.error.details).toHaveProperty('after');
    expect((await as.homeowner.get('/api/service-requests')).status).toBe(403);
    expect((await as.anonymous.get('/api/service-requests')).status).toBe(401);
  });

  it('marks a request scheduled, then closed, recording who and when; another company’s id is 404', async () => {
    const [target] = await rowsFor(boilerId);
    const scheduled = await as.technician.patch(`/api/service-requests/${target.id}`).send({ status: 'scheduled' });
    expect(scheduled.status).toBe(200);
    expect(scheduled.body).toMatchObject({ id: target.id, status: 'scheduled', handledByName: t.technician.user.name });
    const [row] = await ctx.db.select().from(serviceRequests).where(eq(serviceRequests.id, target.id));
    expect(row).toMatchObject({ status: 'scheduled', handledBy: t.technician.user.id });
    expect(row.handledAt).toBeInstanceOf(Date);
    const audit = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entityId, target.id), eq(auditLog.action, 'update')));
    expect(audit[0]).toMatchObject({ actorId: t.technician.user.id, changes: { before: { status: 'new' }, after: { status: 'scheduled' } } });

    const onlyScheduled = await as.manager.get('/api/service-requests').query({ status: 'scheduled' });
    expect(onlyScheduled.body.items.map((i: { id: string }) => i.id)).toEqual([target.id]);
    expect((await as.manager.patch(`/api/service-requests/${target.id}`).send({ status: 'closed' })).body.status).toBe('closed');

    expect((await as.manager.patch(`/api/service-requests/${target.id}`).send({ status: 'new' })).status).toBe(400);
    expect((await as.anonymous.patch(`/api/service-requests/${target.id}`).send({ status: 'closed' })).status).toBe(401);
    expect((await as.homeowner.patch(`/api/service-requests/${target.id}`).send({ status: 'closed' })).status).toBe(403);
    const cross = await otherAs.manager.patch(`/api/service-requests/${target.id}`).send({ status: 'scheduled' });
    expect(cross.status).toBe(404);
    const [still] = await ctx.db.select().from(serviceRequests).where(eq(serviceRequests.id, target.id));
    expect(still.status).toBe('closed');
  });
});

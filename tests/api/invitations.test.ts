import { and, eq, like } from 'drizzle-orm';
import { simpleParser } from 'mailparser';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { readStoredMail } from '../../fakes/smtp';
import { auditLog, homeownerAccounts, invitations, memberships, users, verifications } from '../../server/db/schema/index';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { fakerFor } from '../../server/db/factories/faker';
import { testApp } from '../support/context';
import { eventually } from '../support/outbox';
import { agentsFor, createTenant, signIn, type Agent, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
afterAll(() => ctx.pool.end());

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
});

// Other test files share the SMTP fake, so every address here is new and mail is picked out by its recipient.
const WEEK_MS = 7 * 86_400_000;
const newAddress = () => `${fakerFor().string.alphanumeric(12).toLowerCase()}@example.test`;
const mailTo = (address: string) => readStoredMail(inject('outboxDir')).filter((m) => m.to.includes(address));

async function onlyMailTo(address: string) {
  const mails = mailTo(address);
  expect(mails).toHaveLength(1);
  return simpleParser(mails[0].raw);
}

const VERIFY_LINK = /http:\/\/127\.0\.0\.1:3999\/api\/auth\/magic-link\/verify\?[^\s"<]+/;

function linkIn(text: string | undefined) {
  const found = text?.match(VERIFY_LINK)?.[0];
  expect(found, 'a sign-in link in the mail').toBeTruthy();
  return new URL(found!.replace(/&amp;/g, '&'));
}

/** Opens the e-mailed link in a fresh browser-like agent; better-auth signs in and redirects to the welcome page. */
async function follow(link: URL): Promise<{ agent: Agent; location: string }> {
  const agent = request.agent(app);
  const res = await agent.get(link.pathname + link.search);
  expect(res.status).toBe(302);
  return { agent, location: res.headers.location as string };
}

async function inviteAndOpen(role: 'technician' | 'manager' = 'technician') {
  const email = newAddress();
  const res = await as.manager.post('/api/team/invitations').send({ email, role });
  expect(res.status).toBe(201);
  const mail = await onlyMailTo(email);
  const { agent, location } = await follow(linkIn(mail.text));
  expect(location).toBe(`http://127.0.0.1:3999/welcome/${res.body.id}`);
  return { email, id: res.body.id as string, agent };
}

describe('team invitations', () => {
  it('e-mails a technician a sign-in link that signs them in, and accepting makes them a member', async () => {
    const email = newAddress();
    const before = Date.now();
    const res = await as.manager.post('/api/team/invitations').send({ email: `  ${email.toUpperCase()} `, role: 'technician' });
    const after = Date.now();
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ kind: 'member', email, role: 'technician', status: 'open', customerId: null, invitedByName: t.manager.user.name });
    // Open for 7 days from the moment the request was handled, however long it took.
    expect(Date.parse(res.body.expiresAt)).toBeGreaterThanOrEqual(before + WEEK_MS);
    expect(Date.parse(res.body.expiresAt)).toBeLessThanOrEqual(after + WEEK_MS);
    const [row] = await ctx.db.select().from(invitations).where(eq(invitations.id, res.body.id));
    expect(row).toMatchObject({ companyId: t.company.id, kind: 'member', email, role: 'technician', invitedBy: t.manager.user.id, acceptedAt: null });
    const [invited] = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entityId, res.body.id), eq(auditLog.action, 'invite')));
    expect(invited.actorId).toBe(t.manager.user.id);

    const listed = await as.manager.get('/api/team/invitations');
    expect(listed.status).toBe(200);
    expect(listed.body.map((i: { id: string }) => i.id)).toContain(res.body.id);

    const mail = await onlyMailTo(email);
    expect(mail.subject).toContain(t.company.name);
    expect(mail.text).toContain(`${t.manager.user.name} at ${t.company.name}`);
    expect(mail.text).toContain('as a technician');
    expect(mail.headers.get('x-lifeplate-company')).toBe(t.company.id);
    const link = linkIn(mail.text);
    expect(linkIn(mail.html || undefined).href).toBe(link.href);
    expect(link.searchParams.get('callbackURL')).toBe(`/welcome/${res.body.id}`);

    const { agent, location } = await follow(link);
    expect(location).toBe(`http://127.0.0.1:3999/welcome/${res.body.id}`);
    const me = await agent.get('/api/me');
    expect(me.body.user.email).toBe(email);
    expect(me.body.principal).toBeNull();
    // One time only: the same link does not sign in again.
    const again = await request(app).get(link.pathname + link.search);
    expect(again.headers.location).toContain('error=');

    const seen = await agent.get(`/api/invitations/${res.body.id}`);
    expect(seen.status).toBe(200);
    expect(seen.body).toEqual({ id: res.body.id, kind: 'member', role: 'technician', companyName: t.company.name, status: 'open', needsName: true });

    const nameless = await agent.post(`/api/invitations/${res.body.id}/accept`).send({});
    expect(nameless.status).toBe(400);
    expect(nameless.body.error.details.name).toBeDefined();

    const accepted = await agent.post(`/api/invitations/${res.body.id}/accept`).send({ name: 'Ada Brightwater' });
    expect(accepted.status).toBe(200);
    expect(accepted.body).toMatchObject({ status: 'accepted', needsName: false });
    const [user] = await ctx.db.select().from(users).where(eq(users.email, email));
    expect(user.name).toBe('Ada Brightwater');
    const [membership] = await ctx.db.select().from(memberships).where(eq(memberships.userId, user.id));
    expect(membership).toMatchObject({ companyId: t.company.id, role: 'technician', deactivatedAt: null });
    const [stored] = await ctx.db.select().from(invitations).where(eq(invitations.id, res.body.id));
    expect(stored.acceptedBy).toBe(user.id);
    expect(stored.acceptedAt).toBeInstanceOf(Date);
    const [audit] = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entityId, res.body.id), eq(auditLog.action, 'accept')));
    expect(audit).toMatchObject({ companyId: t.company.id, actorId: user.id, entity: 'invitation' });

    const meAfter = await agent.get('/api/me');
    expect(meAfter.body.principal).toEqual({ kind: 'member', userId: user.id, companyId: t.company.id, role: 'technician' });
    expect(meAfter.body.company.name).toBe(t.company.name);
    expect((await as.manager.get('/api/team/invitations')).body.map((i: { id: string }) => i.id)).not.toContain(res.body.id);

    const twice = await agent.post(`/api/invitations/${res.body.id}/accept`).send({});
    expect(twice.status).toBe(410);
  });

  it('answers 400 with a field error for a bad address or role, and keeps nothing', async () => {
    const bad = await as.manager.post('/api/team/invitations').send({ email: 'not-an-address', role: 'boss' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.email[0]).toMatch(/valid e-mail/);
    expect(bad.body.error.details.role).toBeDefined();
    expect(await ctx.db.select().from(invitations).where(eq(invitations.email, 'not-an-address'))).toHaveLength(0);
  });

  it('is for managers and owners only: 401 signed out, 403 for a technician or a homeowner', async () => {
    const body = { email: newAddress(), role: 'technician' };
    expect((await as.anonymous.post('/api/team/invitations').send(body)).status).toBe(401);
    expect((await as.technician.post('/api/team/invitations').send(body)).status).toBe(403);
    expect((await as.homeowner.post('/api/team/invitations').send(body)).status).toBe(403);
    expect((await as.technician.get('/api/team/invitations')).status).toBe(403);
    expect(mailTo(body.email)).toHaveLength(0);
  });

  it('lets an owner invite an owner but refuses a manager who tries', async () => {
    const email = newAddress();
    const refused = await as.manager.post('/api/team/invitations').send({ email, role: 'owner' });
    expect(refused.status).toBe(403);
    expect(mailTo(email)).toHaveLength(0);
    const byOwner = await as.owner.post('/api/team/invitations').send({ email, role: 'owner' });
    expect(byOwner.status).toBe(201);
    // Nor may a manager revoke or resend the owner's invitation.
    expect((await as.manager.post(`/api/team/invitations/${byOwner.body.id}/revoke`)).status).toBe(403);
    expect((await as.manager.post(`/api/team/invitations/${byOwner.body.id}/resend`)).status).toBe(403);
  });

  it('answers 409 with a field error for someone already on this team', async () => {
    const ours = await as.manager.post('/api/team/invitations').send({ email: t.technician.user.email, role: 'manager' });
    expect(ours.status).toBe(409);
    expect(ours.body.error.details.email[0]).toMatch(/already on your team/);
    expect(mailTo(t.technician.user.email)).toHaveLength(0);
  });

  it('invites someone on another company\'s team like any address, and only they learn, on accepting, that it cannot be', async () => {
    const elsewhere = await createTenant(ctx.db);
    const address = elsewhere.technician.user.email;
    const stranger = await as.manager.post('/api/team/invitations').send({ email: newAddress(), role: 'technician' });
    const res = await as.manager.post('/api/team/invitations').send({ email: address, role: 'technician' });
    expect(res.status).toBe(stranger.status);
    expect(Object.keys(res.body).sort()).toEqual(Object.keys(stranger.body).sort());
    expect(res.body).toMatchObject({ kind: 'member', email: address, role: 'technician', status: 'open' });
    const resent = await as.manager.post(`/api/team/invitations/${res.body.id}/resend`);
    expect(resent.status).toBe(200);
    expect(resent.body.status).toBe('open');
    expect(mailTo(address)).toHaveLength(2);

    const { agent, location } = await follow(linkIn((await simpleParser(mailTo(address)[0].raw)).text));
    expect(location).toBe(`http://127.0.0.1:3999/welcome/${res.body.id}`);
    const refused = await agent.post(`/api/invitations/${res.body.id}/accept`).send({});
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/already belong to another company's team/);
    const theirMemberships = await ctx.db.select().from(memberships).where(eq(memberships.userId, elsewhere.technician.user.id));
    expect(theirMemberships).toEqual([expect.objectContaining({ companyId: elsewhere.company.id, role: 'technician' })]);
    // To the office it stays an open invitation, like one nobody has answered.
    const [stored] = await ctx.db.select().from(invitations).where(eq(invitations.id, res.body.id));
    expect(stored.acceptedAt).toBeNull();
    const listed = (await as.manager.get('/api/team/invitations')).body.find((i: { id: string }) => i.id === res.body.id);
    expect(listed.status).toBe('open');
  });

  it('answers 409 while an invitation to the same address is open', async () => {
    const email = newAddress();
    expect((await as.manager.post('/api/team/invitations').send({ email, role: 'technician' })).status).toBe(201);
    const again = await as.owner.post('/api/team/invitations').send({ email, role: 'manager' });
    expect(again.status).toBe(409);
    expect(again.body.error.details.email).toBeDefined();
  });

  it('revokes and resends, and answers 404 for another company\'s invitation', async () => {
    const email = newAddress();
    const made = await as.manager.post('/api/team/invitations').send({ email, role: 'manager' });
    await ctx.db.update(invitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitations.id, made.body.id));
    expect((await as.manager.get('/api/team/invitations')).body.find((i: { id: string }) => i.id === made.body.id).status).toBe('expired');

    const beforeResend = Date.now();
    const resent = await as.manager.post(`/api/team/invitations/${made.body.id}/resend`);
    const afterResend = Date.now();
    expect(resent.status).toBe(200);
    expect(resent.body.status).toBe('open');
    expect(Date.parse(resent.body.expiresAt)).toBeGreaterThanOrEqual(beforeResend + WEEK_MS);
    expect(Date.parse(resent.body.expiresAt)).toBeLessThanOrEqual(afterResend + WEEK_MS);
    expect(mailTo(email)).toHaveLength(2);

    const otherManager = await signIn(app, other.manager.user.email);
    expect((await otherManager.post(`/api/team/invitations/${made.body.id}/revoke`)).status).toBe(404);
    expect((await otherManager.post(`/api/team/invitations/${made.body.id}/resend`)).status).toBe(404);

    const revoked = await as.manager.post(`/api/team/invitations/${made.body.id}/revoke`);
    expect(revoked.status).toBe(200);
    expect(revoked.body.status).toBe('revoked');
    const [row] = await ctx.db.select().from(invitations).where(eq(invitations.id, made.body.id));
    expect(row.revokedAt).toBeInstanceOf(Date);
    const [audit] = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entityId, made.body.id), eq(auditLog.action, 'revoke')));
    expect(audit.actorId).toBe(t.manager.user.id);
    expect((await as.manager.post(`/api/team/invitations/${made.body.id}/resend`)).status).toBe(410);
    expect((await as.manager.get('/api/team/invitations')).body.map((i: { id: string }) => i.id)).not.toContain(made.body.id);
  });
});

describe('accepting', () => {
  it('answers 410 once the invitation is revoked or expired, even with a valid sign-in', async () => {
    const revoked = await inviteAndOpen();
    await as.manager.post(`/api/team/invitations/${revoked.id}/revoke`);
    const r = await revoked.agent.post(`/api/invitations/${revoked.id}/accept`).send({ name: 'Rowan Ashdown' });
    expect(r.status).toBe(410);

    const expired = await inviteAndOpen('manager');
    await ctx.db.update(invitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitations.id, expired.id));
    const e = await expired.agent.post(`/api/invitations/${expired.id}/accept`).send({ name: 'Tamsin Holloway' });
    expect(e.status).toBe(410);
    for (const { email } of [revoked, expired]) {
      const [user] = await ctx.db.select().from(users).where(eq(users.email, email));
      expect(await ctx.db.select().from(memberships).where(eq(memberships.userId, user.id))).toHaveLength(0);
    }
  });

  it('answers 404 to anyone else signed in, and 401 signed out', async () => {
    const { id } = await inviteAndOpen();
    expect((await as.technician.get(`/api/invitations/${id}`)).status).toBe(404);
    expect((await as.technician.post(`/api/invitations/${id}/accept`).send({ name: 'Someone Else' })).status).toBe(404);
    expect((await as.homeowner.post(`/api/invitations/${id}/accept`).send({})).status).toBe(404);
    expect((await as.anonymous.post(`/api/invitations/${id}/accept`).send({})).status).toBe(401);
    const [row] = await ctx.db.select().from(invitations).where(eq(invitations.id, id));
    expect(row.acceptedAt).toBeNull();
  });

  it('does not make an account from the link of a revoked invitation', async () => {
    const email = newAddress();
    const made = await as.manager.post('/api/team/invitations').send({ email, role: 'technician' });
    await as.manager.post(`/api/team/invitations/${made.body.id}/revoke`);
    const { agent, location } = await follow(linkIn((await onlyMailTo(email)).text));
    expect(location).toContain('error=');
    expect((await agent.get('/api/me')).body).toEqual({ user: null });
    expect(await ctx.db.select().from(users).where(eq(users.email, email))).toHaveLength(0);
  });
});

describe('homeowner invitations', () => {
  it('invites the customer at their own address; accepting shows that customer\'s appliances only', async () => {
    const customer = await insertCustomer(ctx.db, { companyId: t.company.id, email: newAddress() });
    const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: customer.id });
    const boiler = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id });
    const neighbourSite = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
    const neighbours = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: neighbourSite.id });

    const res = await as.technician.post(`/api/customers/${customer.id}/homeowner-invitation`).send({});
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ kind: 'homeowner', email: customer.email, customerId: customer.id, role: null, status: 'open' });
    const mail = await onlyMailTo(customer.email!);
    expect(mail.subject).toContain(t.company.name);
    expect(mail.text).toContain('No password is needed');

    const { agent, location } = await follow(linkIn(mail.text));
    expect(location).toBe(`http://127.0.0.1:3999/welcome/${res.body.id}`);
    const seen = await agent.get(`/api/invitations/${res.body.id}`);
    expect(seen.body).toMatchObject({ kind: 'homeowner', role: null, companyName: t.company.name, needsName: false });
    const accepted = await agent.post(`/api/invitations/${res.body.id}/accept`).send({});
    expect(accepted.status).toBe(200);

    const [user] = await ctx.db.select().from(users).where(eq(users.email, customer.email!));
    const links = await ctx.db.select().from(homeownerAccounts).where(eq(homeownerAccounts.userId, user.id));
    expect(links).toEqual([expect.objectContaining({ companyId: t.company.id, customerId: customer.id })]);
    const [audit] = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entityId, res.body.id), eq(auditLog.action, 'accept')));
    expect(audit.actorId).toBe(user.id);

    const mine = await agent.get('/api/homeowner/appliances');
    expect(mine.status).toBe(200);
    expect(mine.body.map((a: { id: string }) => a.id)).toEqual([boiler.id]);
    expect(mine.body.map((a: { id: string }) => a.id)).not.toContain(neighbours.id);
  });

  it('takes another address when given, and 400 with a field error when the customer has none', async () => {
    const customer = await insertCustomer(ctx.db, { companyId: t.company.id, email: null });
    const none = await as.manager.post(`/api/customers/${customer.id}/homeowner-invitation`).send({ email: '' });
    expect(none.status).toBe(400);
    expect(none.body.error.details.email).toBeDefined();
    const badAddress = await as.manager.post(`/api/customers/${customer.id}/homeowner-invitation`).send({ email: 'at@' });
    expect(badAddress.status).toBe(400);
    expect(badAddress.body.error.details.email).toBeDefined();
    const email = newAddress();
    const given = await as.manager.post(`/api/customers/${customer.id}/homeowner-invitation`).send({ email });
    expect(given.status).toBe(201);
    expect(given.body.email).toBe(email);
    expect(mailTo(email)).toHaveLength(1);
  });

  it('refuses the address of a member of this team; another company\'s member is invited like anyone and refused on accepting', async () => {
    const customer = await insertCustomer(ctx.db, { companyId: t.company.id, email: null });
    const ours = await as.manager.post(`/api/customers/${customer.id}/homeowner-invitation`).send({ email: t.technician.user.email });
    expect(ours.status).toBe(409);
    expect(ours.body.error.details.email[0]).toMatch(/member of your team/);

    const elsewhere = await createTenant(ctx.db);
    const address = elsewhere.manager.user.email;
    const res = await as.manager.post(`/api/customers/${customer.id}/homeowner-invitation`).send({ email: address });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ kind: 'homeowner', email: address, customerId: customer.id, status: 'open' });
    const { agent } = await follow(linkIn((await onlyMailTo(address)).text));
    const refused = await agent.post(`/api/invitations/${res.body.id}/accept`).send({});
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/already belong to another company's team/);
    expect(await ctx.db.select().from(homeownerAccounts).where(eq(homeownerAccounts.userId, elsewhere.manager.user.id))).toHaveLength(0);
  });

  it('answers 401 signed out, 403 to a homeowner, 404 for another company\'s customer', async () => {
    expect((await as.anonymous.post(`/api/customers/${t.customer.id}/homeowner-invitation`).send({})).status).toBe(401);
    expect((await as.homeowner.post(`/api/customers/${t.customer.id}/homeowner-invitation`).send({})).status).toBe(403);
    const foreign = await as.manager.post(`/api/customers/${other.customer.id}/homeowner-invitation`).send({});
    expect(foreign.status).toBe(404);
    expect(await ctx.db.select().from(invitations).where(eq(invitations.customerId, other.customer.id))).toHaveLength(0);
  });
});

describe('the magic-link endpoint', () => {
  const ask = (email: string) => request(app).post('/api/auth/sign-in/magic-link').send({ email, callbackURL: '/' });
  const tokensFor = (email: string) => ctx.db.select().from(verifications).where(like(verifications.value, `%"${email}"%`));

  it('answers the same to an address nobody invited but makes and sends no link', async () => {
    const stranger = newAddress();
    const res = await ask(stranger);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: true });
    expect(await tokensFor(stranger)).toHaveLength(0);

    // A known homeowner asking at the same moment does get a link (sent in the background), and still no mail for the stranger.
    const known = await ask(t.homeowner.user.email);
    expect(known.body).toEqual({ status: true });
    expect(await tokensFor(t.homeowner.user.email)).toHaveLength(1);
    await waitFor(() => mailTo(t.homeowner.user.email).length > 0);
    expect(mailTo(stranger)).toHaveLength(0);
    const mail = await onlyMailTo(t.homeowner.user.email);
    expect(mail.subject).toBe('Your Lifeplate sign-in link');
  });

  it('sends a fresh link to an address with an open invitation', async () => {
    const email = newAddress();
    await as.manager.post('/api/team/invitations').send({ email, role: 'technician' });
    expect((await ask(email)).body).toEqual({ status: true });
    expect(await tokensFor(email)).toHaveLength(2);
  });
});

/**
 * The browser's request answers before its mail is sent (so its timing tells nothing); wait for the mail itself.
 * The bound only stops a lost mail from hanging the run; it sits well inside the test's own time limit.
 */
async function waitFor(done: () => boolean) {
  await eventually(async () => done(), { tries: 300, everyMs: 50 });
}

import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, reminders, timelineEvents, visits } from '../../server/db/schema/index';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { createApp } from '../../server/app';
import { todayInTimeZone } from '../../shared/dates';
import { addMonths } from '../../shared/trade/iso-date';
import { closeContext } from '../../server/build-context';
import { testApp } from '../support/context';
import { mailTo, uniqueEmail } from '../support/outbox';
import { agentsFor, createTenant, signIn, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
const ids: Record<string, string> = {};
const emails: Record<string, string> = {};
let lastAnnualOn: string;

async function boilerFor(tenant: Tenant, name: string, customer: { email: string | null; remindersOptOut?: boolean }) {
  const owner = await insertCustomer(ctx.db, { companyId: tenant.company.id, ...customer });
  const site = await insertSite(ctx.db, { companyId: tenant.company.id, customerId: owner.id });
  const a = await insertAppliance(ctx.db, { companyId: tenant.company.id, siteId: site.id });
  await ctx.db.insert(visits).values({ companyId: tenant.company.id, applianceId: a.id, type: 'annual_maintenance', status: 'completed', visitedOn: lastAnnualOn });
  ids[name] = a.id;
  if (owner.email) emails[name] = owner.email;
}

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  lastAnnualOn = addMonths(todayInTimeZone(t.company.timeZone), -13);
  await boilerFor(t, 'lapsed', { email: uniqueEmail() });
  await boilerFor(t, 'optedOut', { email: uniqueEmail(), remindersOptOut: true });
  await boilerFor(t, 'noEmail', { email: null });
  await boilerFor(other, 'elsewhere', { email: uniqueEmail() });
});
afterAll(() => closeContext(ctx));

describe('POST /api/reminders/annual-service/:applianceId (the office sends a reminder)', () => {
  it('sends it, records the row, the timeline event and an audit row', async () => {
    const res = await as.manager.post(`/api/reminders/annual-service/${ids.lapsed}`);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      applianceId: ids.lapsed,
      kind: 'annual_service',
      dueOn: addMonths(lastAnnualOn, 12),
      status: 'sent',
      trigger: 'office',
      toEmail: emails.lapsed,
      attempts: 1,
    });
    const [row] = await ctx.db.select().from(reminders).where(eq(reminders.applianceId, ids.lapsed));
    expect(row).toMatchObject({ id: res.body.id, status: 'sent', requestedBy: t.manager.user.id, companyId: t.company.id });
    const [audit] = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entity, 'reminder'), eq(auditLog.entityId, row.id)));
    expect(audit).toMatchObject({ actorId: t.manager.user.id, action: 'send', companyId: t.company.id });
    const events = await ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.applianceId, ids.lapsed), eq(timelineEvents.kind, 'reminder')));
    expect(events).toEqual([expect.objectContaining({ refId: row.id, actorId: t.manager.user.id })]);
    expect(mailTo(emails.lapsed)).toHaveLength(1);
  });

  it('409 when this period’s reminder was already sent; nothing is sent twice', async () => {
    const res = await as.owner.post(`/api/reminders/annual-service/${ids.lapsed}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/already sent on \d{4}-\d{2}-\d{2}/);
    expect(await ctx.db.select().from(reminders).where(eq(reminders.applianceId, ids.lapsed))).toHaveLength(1);
    expect(mailTo(emails.lapsed)).toHaveLength(1);
  });

  it('409 when the customer opted out or has no e-mail, writing nothing', async () => {
    const optedOut = await as.manager.post(`/api/reminders/annual-service/${ids.optedOut}`);
    expect(optedOut.status).toBe(409);
    expect(optedOut.body.error.message).toMatch(/opted out/);
    const noEmail = await as.manager.post(`/api/reminders/annual-service/${ids.noEmail}`);
    expect(noEmail.status).toBe(409);
    expect(noEmail.body.error.message).toMatch(/no e-mail/);
    expect(await ctx.db.select().from(reminders).where(eq(reminders.applianceId, ids.optedOut))).toEqual([]);
    expect(mailTo(emails.optedOut)).toHaveLength(0);
  });

  it('400 for a malformed id, 401 signed out, 403 for a technician or homeowner, 404 for another company’s appliance', async () => {
    const bad = await as.manager.post('/api/reminders/annual-service/not-an-id');
    expect(bad.status).toBe(400);
    expect(bad.body.error.details).toHaveProperty('applianceId');
    expect((await as.anonymous.post(`/api/reminders/annual-service/${ids.lapsed}`)).status).toBe(401);
    expect((await as.technician.post(`/api/reminders/annual-service/${ids.lapsed}`)).status).toBe(403);
    expect((await as.homeowner.post(`/api/reminders/annual-service/${ids.lapsed}`)).status).toBe(403);
    const elsewhere = await as.manager.post(`/api/reminders/annual-service/${ids.elsewhere}`);
    expect(elsewhere.status).toBe(404);
    expect(await ctx.db.select().from(reminders).where(eq(reminders.applianceId, ids.elsewhere))).toEqual([]);
    expect(mailTo(emails.elsewhere)).toHaveLength(0);
  });
});

describe('GET /api/reminders', () => {
  it('lists the company’s recent reminders newest first, paged by cursor, to anyone who reads records', async () => {
    const forOther = await agentsFor(app, other);
    expect((await forOther.manager.post(`/api/reminders/annual-service/${ids.elsewhere}`)).status).toBe(201);
    // A second reminder of our own, so there are two pages of one.
    const owner = await insertCustomer(ctx.db, { companyId: t.company.id, email: uniqueEmail() });
    const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: owner.id });
    const a = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id });
    expect((await as.owner.post(`/api/reminders/annual-service/${a.id}`)).status).toBe(201);

    const first = await as.technician.get('/api/reminders?limit=1');
    expect(first.status).toBe(200);
    expect(first.body.items).toEqual([expect.objectContaining({ applianceId: a.id, customerName: owner.name, status: 'sent' })]);
    expect(first.body.nextCursor).toEqual(expect.any(String));
    const second = await as.technician.get(`/api/reminders?limit=1&before=${encodeURIComponent(first.body.nextCursor)}`);
    expect(second.body.items).toEqual([expect.objectContaining({ applianceId: ids.lapsed })]);
    expect(second.body.nextCursor).toBeNull();
    const all = await as.manager.get('/api/reminders');
    expect(all.body.items.map((r: { applianceId: string }) => r.applianceId)).not.toContain(ids.elsewhere);
    const filtered = await as.manager.get(`/api/reminders?applianceId=${ids.lapsed}`);
    expect(filtered.body.items.map((r: { applianceId: string }) => r.applianceId)).toEqual([ids.lapsed]);
  });

  it('400 for a bad cursor or limit, 401 signed out, 403 for a homeowner', async () => {
    const badCursor = await as.manager.get('/api/reminders?before=yesterday');
    expect(badCursor.status).toBe(400);
    expect(badCursor.body.error.details).toHaveProperty('before');
    expect((await as.manager.get('/api/reminders?limit=0')).status).toBe(400);
    expect((await as.anonymous.get('/api/reminders')).status).toBe(401);
    expect((await as.homeowner.get('/api/reminders')).status).toBe(403);
  });
});

describe('GET /api/dev/outbox', () => {
  it('shows the owner the company’s own sent mail, parsed, and nobody else’s', async () => {
    const res = await as.owner.get('/api/dev/outbox?limit=200');
    expect(res.status).toBe(200);
    const ours = res.body.find((m: { to: string[] }) => m.to.includes(emails.lapsed));
    expect(ours).toMatchObject({ subject: expect.stringContaining(t.company.name), text: expect.stringContaining('yearly service') });
    expect(ours.html).toContain('Stop reminder e-mails');
    expect(res.body.some((m: { to: string[] }) => m.to.includes(emails.elsewhere))).toBe(false);
    // Its invitation and sign-in links would sign a manager in as the invitee.
    expect((await as.manager.get('/api/dev/outbox')).status).toBe(403);
    expect((await as.technician.get('/api/dev/outbox')).status).toBe(403);
    expect((await as.homeowner.get('/api/dev/outbox')).status).toBe(403);
    expect((await as.anonymous.get('/api/dev/outbox')).status).toBe(401);
    expect((await as.owner.get('/api/me')).body.devOutbox).toBe(true);
    expect((await as.manager.get('/api/me')).body.devOutbox).toBe(false);
  });

  it('does not exist without the local SMTP fake', async () => {
    const plain = createApp({ ...ctx, config: { ...ctx.config, FAKE_SMTP_OUTBOX: undefined } });
    const owner = await signIn(plain, t.owner.user.email);
    expect((await owner.get('/api/dev/outbox')).status).toBe(404);
    expect((await owner.get('/api/me')).body.devOutbox).toBe(false);
  });

  it('does not exist when mail goes to a real server, even with the fake’s folder set', async () => {
    const real = createApp({ ...ctx, config: { ...ctx.config, SMTP_HOST: 'mail.example.test' } });
    const owner = await signIn(real, t.owner.user.email);
    expect((await owner.get('/api/dev/outbox')).status).toBe(404);
    expect((await owner.get('/api/me')).body.devOutbox).toBe(false);
  });
});

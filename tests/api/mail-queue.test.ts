import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { and, eq, gte, inArray, or } from 'drizzle-orm';
import { simpleParser } from 'mailparser';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readStoredMail, startFakeSmtp } from '../../fakes/smtp';
import { outgoingMail, serviceRequests } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { mailJob } from '../../server/jobs/mail-job';
import { open } from '../../server/lib/sealed-box';
import { createMailQueue, MAIL_SEAL_PURPOSE } from '../../server/modules/mail/mail-queue';
import { closeContext } from '../../server/build-context';
import { createApp } from '../../server/app';
import { testContext } from '../support/context';
import { freePort } from '../support/global-setup';
import { eventually, uniqueEmail } from '../support/outbox';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

// A mail server of this file's own, on a port where nothing listens until the test starts it.
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-mail-queue-'));
let port: number;
let ctx: ReturnType<typeof testContext>;
let app: ReturnType<typeof createApp>;
let t: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let smtp: Awaited<ReturnType<typeof startFakeSmtp>> | undefined;

beforeAll(async () => {
  port = await freePort();
  ctx = testContext({ SMTP_PORT: String(port), FAKE_SMTP_OUTBOX: dir });
  app = createApp(ctx);
  t = await createTenant(ctx.db);
  as = await agentsFor(app, t);
});
afterAll(async () => {
  await smtp?.close();
  await closeContext(ctx);
  fs.rmSync(dir, { recursive: true, force: true });
});

const received = (address: string) => readStoredMail(dir).filter((m) => m.to.includes(address.toLowerCase()));
const rowsAbout = (refId: string) => ctx.db.select().from(outgoingMail).where(eq(outgoingMail.refId, refId)).orderBy(outgoingMail.createdAt);

describe('e-mail while the mail server is down', () => {
  it('keeps invitations, service requests and sign-in links queued, and sends each exactly once when the server is back', async () => {
    const startedAt = new Date(Date.now() - 1000);

    // An invitation, then "Send again" while the server is still down.
    const invitee = uniqueEmail();
    const invited = await as.manager.post('/api/team/invitations').send({ email: invitee, role: 'technician' });
    expect(invited.status).toBe(201);
    expect(invited.body.mail).toBe('queued');
    const resent = await as.manager.post(`/api/team/invitations/${invited.body.id}/resend`);
    expect(resent.status).toBe(200);
    expect(resent.body.mail).toBe('queued');
    const [replaced, fresh] = await rowsAbout(invited.body.id);
    expect(replaced).toMatchObject({ kind: 'invitation', status: 'cancelled', sealed: null });
    expect(fresh).toMatchObject({ kind: 'invitation', status: 'queued', attempts: 1, companyId: t.company.id, sentAt: null });
    expect(fresh.lastError).toBeTruthy();
    // Sealed: neither the address nor the sign-in link is readable in the table.
    expect(fresh.sealed).not.toContain(invitee);
    expect(fresh.sealed).not.toContain('magic-link');
    const listed = await as.manager.get('/api/team/invitations');
    expect(listed.body.find((i: { id: string }) => i.id === invited.body.id).mail).toBe('queued');

    // A homeowner's service request through a share link.
    const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
    const boiler = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id });
    const link = await as.manager.post(`/api/appliances/${boiler.id}/share-links`).send({});
    const token = String(link.body.url).split('/s/')[1];
    const asked = await request(app).post(`/api/share/${token}/service-requests`).send({ contactName: 'Mail Down', contactPhone: '555-0101' });
    expect(asked.status).toBe(201);
    const [requestRow] = await ctx.db.select().from(serviceRequests).where(eq(serviceRequests.id, asked.body.id));
    expect(requestRow.officeNotifiedAt).toBeNull();
    const queuedRequest = (await as.manager.get('/api/service-requests')).body.items.find((i: { id: string }) => i.id === asked.body.id);
    expect(queuedRequest).toMatchObject({ officeNotifiedAt: null, officeMail: 'queued' });

    // A sign-in link asked for from the sign-in page: answered at once, mail written after the answer.
    const signInLink = await request(app).post('/api/auth/sign-in/magic-link').send({ email: t.technician.user.email, callbackURL: '/' });
    expect(signInLink.status).toBe(200);
    const signInRow = await eventually(async () => {
      const rows = await ctx.db
        .select()
        .from(outgoingMail)
        .where(and(eq(outgoingMail.kind, 'sign_in'), gte(outgoingMail.createdAt, startedAt), eq(outgoingMail.status, 'queued')));
      return rows.find((r) => r.attempts === 1 && JSON.parse(open(ctx.config.BETTER_AUTH_SECRET, MAIL_SEAL_PURPOSE, r.sealed!)).to === t.technician.user.email);
    });

    expect(readStoredMail(dir)).toHaveLength(0);

    // The server comes back, and the retry's backoff has run out.
    smtp = await startFakeSmtp({ port, directory: dir });
    const mine = or(eq(outgoingMail.companyId, t.company.id), eq(outgoingMail.id, signInRow.id));
    await ctx.db.update(outgoingMail).set({ nextAttemptAt: new Date(Date.now() - 60_000) }).where(and(mine, eq(outgoingMail.status, 'queued')));
    expect(await mailJob(ctx, { companyIds: [t.company.id] })).toEqual({ sent: 2, queued: 0, failed: 0 });
    expect(await ctx.mail.deliverDue({ ids: [signInRow.id] })).toEqual({ sent: 1, queued: 0, failed: 0 });

    // A second run finds nothing left to send.
    expect(await mailJob(ctx, { companyIds: [t.company.id] })).toEqual({ sent: 0, queued: 0, failed: 0 });
    expect(await ctx.mail.deliverDue({ ids: [signInRow.id] })).toEqual({ sent: 0, queued: 0, failed: 0 });

    expect(received(invitee)).toHaveLength(1);
    expect(received(t.owner.user.email)).toHaveLength(1);
    expect(received(t.owner.user.email)[0].to.sort()).toEqual([t.owner.user.email, t.manager.user.email].map((e) => e.toLowerCase()).sort());
    expect(received(t.technician.user.email)).toHaveLength(1);
    const sent = await ctx.db.select().from(outgoingMail).where(inArray(outgoingMail.id, [fresh.id, signInRow.id]));
    expect(sent.map((r) => [r.status, r.sealed])).toEqual([
      ['sent', null],
      ['sent', null],
    ]);

    expect((await as.manager.get('/api/team/invitations')).body.find((i: { id: string }) => i.id === invited.body.id).mail).toBe('sent');
    const [notified] = await ctx.db.select().from(serviceRequests).where(eq(serviceRequests.id, asked.body.id));
    expect(notified.officeNotifiedAt).toBeInstanceOf(Date);
    const shown = (await as.manager.get('/api/service-requests')).body.items.find((i: { id: string }) => i.id === asked.body.id);
    expect(shown.officeMail).toBe('sent');

    // The late invitation still works: its link signs the invitee in and lands on the welcome page.
    const mail = await simpleParser(received(invitee)[0].raw);
    const verify = new URL(/http:\/\/127\.0\.0\.1:3999\/api\/auth\/magic-link\/verify\?[^\s"<]+/.exec(mail.text ?? '')![0]);
    const opened = await request(app).get(verify.pathname + verify.search);
    expect(opened.status).toBe(302);
    expect(opened.headers.location).toBe(`http://127.0.0.1:3999/welcome/${invited.body.id}`);
  });
});

describe('the mail queue on its own', () => {
  const message = { to: 'someone@example.test', subject: 'Test', text: 'Plain words.', html: '<p>Plain words.</p>' };

  it('gives up at once on a permanent refusal (SMTP 5xx) and drops the stored message', async () => {
    const refusing = { send: async () => Promise.reject(Object.assign(new Error('550 mailbox unavailable'), { responseCode: 550 })) };
    const queue = createMailQueue({ db: ctx.db, mailer: refusing, logger: ctx.logger, secret: ctx.config.BETTER_AUTH_SECRET });
    const id = await queue.enqueue(ctx.db, message, { kind: 'service_request', companyId: t.company.id });
    expect(await queue.deliver(id)).toBe('failed');
    const [row] = await ctx.db.select().from(outgoingMail).where(eq(outgoingMail.id, id));
    expect(row).toMatchObject({ status: 'failed', attempts: 1, sealed: null });
  });

  it('retries a passing failure after its backoff, not before, and sends once the server takes it', async () => {
    let down = true;
    const sentTo: string[] = [];
    const flaky = {
      send: async (m: { to: string }) => {
        if (down) throw Object.assign(new Error('connect ECONNREFUSED'), { code: 'ECONNREFUSED' });
        sentTo.push(m.to);
        return { messageId: '<one@example.test>', accepted: [m.to] };
      },
    };
    const clock = new Date('2026-03-02T10:00:00Z');
    const queue = createMailQueue({ db: ctx.db, mailer: flaky, logger: ctx.logger, secret: ctx.config.BETTER_AUTH_SECRET, clock: () => clock });
    const id = await queue.enqueue(ctx.db, message, { kind: 'sign_in', companyId: null });
    expect(await queue.deliver(id)).toBe('queued');
    const [queued] = await ctx.db.select().from(outgoingMail).where(eq(outgoingMail.id, id));
    // The first retry waits a minute (server/modules/mail/mail-retry.ts).
    expect(queued.nextAttemptAt.toISOString()).toBe('2026-03-02T10:01:00.000Z');
    down = false;
    expect(await queue.deliverDue({ ids: [id], now: new Date('2026-03-02T10:00:59Z') })).toEqual({ sent: 0, queued: 0, failed: 0 });
    expect(await queue.deliverDue({ ids: [id], now: new Date('2026-03-02T10:01:00Z') })).toEqual({ sent: 1, queued: 0, failed: 0 });
    expect(sentTo).toEqual(['someone@example.test']);
    const [sent] = await ctx.db.select().from(outgoingMail).where(eq(outgoingMail.id, id));
    expect(sent).toMatchObject({ status: 'sent', attempts: 2, messageId: '<one@example.test>', sealed: null });
  });
});

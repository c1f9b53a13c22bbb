import { Writable } from 'node:stream';
import { sql } from 'drizzle-orm';
import express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildContext } from '../../server/build-context';
import { createApp } from '../../server/app';
import { createLogger, requestLogger } from '../../server/logger';
import { errorHandler } from '../../server/middleware/error-handler';
import { redactUrl } from '../../server/log-redaction';
import { users } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { unsubscribeToken } from '../../server/modules/reminders/unsubscribe-token';
import { bookingReplyToken } from '../../server/modules/booking-notices/booking-reply-token';
import { insertBooking } from '../../server/db/factories/bookings';
import { testConfig } from '../support/context';
import { eventually, parsedMailTo, uniqueEmail } from '../support/outbox';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

// Everything this file's app logs, at info level, as the lines a log shipper would keep.
const lines: string[] = [];
const sink = new Writable({
  write(chunk, _encoding, done) {
    lines.push(String(chunk));
    done();
  },
});
const logger = createLogger('info', 'json', sink);
const ctx = buildContext(testConfig({ LOG_LEVEL: 'info', LOG_FORMAT: 'json' }), { logger });
const app = createApp(ctx);
const log = () => lines.join('');

let t: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
beforeAll(async () => {
  t = await createTenant(ctx.db);
  as = await agentsFor(app, t);
});
afterAll(() => ctx.pool.end());

describe('request logs', () => {
  it('show share, unsubscribe, sign-in link and invitation URLs without their tokens', async () => {
    const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
    const boiler = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id });
    const link = await as.manager.post(`/api/appliances/${boiler.id}/share-links`).send({});
    const shareToken = String(link.body.url).split('/s/')[1];
    const referer = `http://127.0.0.1:3999/s/${shareToken}`;
    expect((await request(app).get(`/api/share/${shareToken}`).set('Referer', referer)).status).toBe(200);
    await request(app).get(`/s/${shareToken}`);

    const unsubscribe = unsubscribeToken(ctx.config.BETTER_AUTH_SECRET, t.customer.id);
    expect((await request(app).get(`/api/unsubscribe/${unsubscribe}`)).status).toBe(200);
    await request(app).get(`/unsubscribe/${unsubscribe}`);

    const booking = await insertBooking(ctx.db, { companyId: t.company.id, siteId: site.id, technicianId: t.technician.user.id, applianceIds: [boiler.id] });
    const reply = bookingReplyToken(ctx.config.BETTER_AUTH_SECRET, booking.id);
    expect((await request(app).get(`/api/booking-reply/${reply}`)).status).toBe(200);
    await request(app).get(`/booking-reply/${reply}`);

    const invitee = uniqueEmail();
    const invited = await as.manager.post('/api/team/invitations').send({ email: invitee, role: 'technician' });
    expect(invited.status).toBe(201);
    const [mail] = await eventually(() => parsedMailTo(invitee).then((m) => (m.length ? m : null)));
    const verify = new URL(/http:\/\/127\.0\.0\.1:3999\/api\/auth\/magic-link\/verify\?[^\s"<]+/.exec(mail.text ?? '')![0]);
    const magicToken = verify.searchParams.get('token')!;
    const agent = request.agent(app);
    const opened = await agent.get(verify.pathname + verify.search);
    expect(opened.status).toBe(302);
    expect((await agent.get(`/api/invitations/${invited.body.id}`)).status).toBe(200);

    for (const secret of [shareToken, unsubscribe, reply.split('.')[1], magicToken, invited.body.id]) expect(log()).not.toContain(secret);
    const shownPaths = ['/api/share/[token]', '/s/[token]', '/api/unsubscribe/[token]', '/unsubscribe/[token]', '/api/booking-reply/[token]', '/booking-reply/[token]'];
    for (const shown of [...shownPaths, 'token=[token]', '/api/invitations/[invitation]']) {
      expect(log()).toContain(shown);
    }
    // The redirect's Location and the callback in the link's URL name the welcome page, not the invitation.
    expect(log()).toContain('/welcome/[invitation]');
  });

  it('redacts each capability path and query parameter, keeping the rest of the URL', () => {
    expect(redactUrl('/s/abc123')).toBe('/s/[token]');
    expect(redactUrl('/S/abc123/')).toBe('/s/[token]/');
    expect(redactUrl('/api/share/abc123/photos/p1/thumb')).toBe('/api/share/[token]/photos/p1/thumb');
    expect(redactUrl('/api/unsubscribe/abc.def')).toBe('/api/unsubscribe/[token]');
    expect(redactUrl('/api/auth/reset-password/abc?callbackURL=%2F')).toBe('/api/auth/reset-password/[token]?callbackURL=%2F');
    expect(redactUrl('/api/auth/magic-link/verify?token=abc&callbackURL=%2Fwelcome%2F42')).toBe(
      '/api/auth/magic-link/verify?token=[token]&callbackURL=%2Fwelcome%2F%5Binvitation%5D',
    );
    expect(redactUrl('https://lifeplate.example/welcome/42#top')).toBe('https://lifeplate.example/welcome/[invitation]');
    // Tag codes are printed on the appliance; office ids name no capability.
    expect(redactUrl('/t/K7Q2M9')).toBe('/t/K7Q2M9');
    expect(redactUrl('/api/customers/42?q=Pell')).toBe('/api/customers/42?q=Pell');
  });
});

describe('failed queries in the logs', () => {
  const name = `Agnes Marrow-Quill ${Date.now()}`;

  it('name the query but not the values it ran with, through the error handler', async () => {
    const failing = express();
    failing.use(requestLogger(logger, 'json'));
    failing.get('/boom', async (_req, _res, next) => {
      try {
        await ctx.db.execute(sql`select ${name}::int as n, ${'notes: gas smell near the flue'} as note`);
      } catch (err) {
        next(err);
      }
    });
    failing.use(errorHandler);
    expect((await request(failing).get('/boom')).status).toBe(500);
    const entry = lines.map((l) => JSON.parse(l)).find((l) => l.msg === 'request failed');
    expect(entry.err.message).toMatch(/^Failed query: select \$1::int as n, \$2 as note/);
    expect(log()).not.toContain('Agnes Marrow-Quill');
    expect(log()).not.toContain('gas smell');
  });

  it('keep the constraint of a refused write but not the row that broke it', async () => {
    try {
      await ctx.db.insert(users).values({ name, email: t.owner.user.email, emailVerified: true });
      expect.unreachable();
    } catch (err) {
      logger.error({ err }, 'write refused');
    }
    const entry = lines.map((l) => JSON.parse(l)).find((l) => l.msg === 'write refused');
    expect(JSON.stringify(entry)).toMatch(/users_email_unique|23505/);
    expect(log()).not.toContain(t.owner.user.email);
    expect(log()).not.toContain('Agnes Marrow-Quill');
  });
});

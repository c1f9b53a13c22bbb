import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import type { ParsedMail } from 'mailparser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, componentCatalog, customers, reminders, timelineEvents, visits } from '../../server/db/schema/index';
import { insertCompany } from '../../server/db/factories/companies';
import { insertAppliance, insertComponent, insertCustomer, insertSite } from '../../server/db/factories/records';
import { runReminders } from '../../server/modules/reminders/reminders.service';
import type { AppContext } from '../../server/context';
import { todayInTimeZone } from '../../shared/dates';
import { addDays, addMonths } from '../../shared/trade/iso-date';
import { closeContext } from '../../server/build-context';
import { testApp } from '../support/context';
import { mailTo, parsedMailTo, uniqueEmail } from '../support/outbox';
import { createTenant, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
afterAll(() => closeContext(ctx));

type Customer = Awaited<ReturnType<typeof insertCustomer>>;

async function customer(companyId: string, fields: Partial<Customer> = {}) {
  return insertCustomer(ctx.db, { companyId, email: uniqueEmail(), ...fields });
}

/** An in-service boiler of `owner`; `annualMonthsAgo` adds completed annual-maintenance visits. */
async function boiler(companyId: string, owner: Customer, opts: { annualMonthsAgo?: number[]; status?: 'in_service' | 'removed' } = {}) {
  const site = await insertSite(ctx.db, { companyId, customerId: owner.id });
  const a = await insertAppliance(ctx.db, { companyId, siteId: site.id, status: opts.status ?? 'in_service' });
  const today = todayInTimeZone('America/New_York');
  const dates = (opts.annualMonthsAgo ?? []).map((m) => addMonths(today, -m));
  for (const visitedOn of dates) {
    await ctx.db.insert(visits).values({ companyId, applianceId: a.id, type: 'annual_maintenance', status: 'completed', visitedOn });
  }
  const last = dates.sort().at(-1);
  return { ...a, annualDueOn: last ? addMonths(last, 12) : null };
}

const rowsOf = (companyId: string) => ctx.db.select().from(reminders).where(eq(reminders.companyId, companyId));
const reminderEvents = (applianceId: string) =>
  ctx.db.select().from(timelineEvents).where(and(eq(timelineEvents.applianceId, applianceId), eq(timelineEvents.kind, 'reminder')));
/** A header as one line (long ones are folded onto several). */
const headerLine = (mail: ParsedMail, key: string) => mail.headerLines.find((h) => h.key === key)?.line.replace(/\r?\n[ \t]+/g, ' ');
const unsubscribeLink = (mail: ParsedMail) => /href="([^"]*\/unsubscribe\/[^"]+)"/.exec(String(mail.html))?.[1];

describe('the scheduled reminder run', () => {
  let t: Tenant;
  let today: string;
  const c: Record<string, Customer> = {};
  const b: Record<string, Awaited<ReturnType<typeof boiler>>> = {};
  let thermocoupleLabel: string;

  beforeAll(async () => {
    t = await createTenant(ctx.db);
    const id = t.company.id;
    today = todayInTimeZone(t.company.timeZone);
    c.agnes = await customer(id);
    c.optedOut = await customer(id, { remindersOptOut: true });
    c.noEmail = await customer(id, { email: null });
    c.upToDate = await customer(id);
    c.oneClick = await customer(id);
    b.lapsed = await boiler(id, c.agnes, { annualMonthsAgo: [26, 14] });
    b.partDue = await boiler(id, c.agnes, { annualMonthsAgo: [2] });
    await insertComponent(ctx.db, { companyId: id, applianceId: b.partDue.id, typeCode: 'thermocouple', spec: { lengthIn: 24 }, dueOn: addDays(today, 10), dueKind: 'replacement' });
    await insertComponent(ctx.db, { companyId: id, applianceId: b.partDue.id, typeCode: 'thermopile', spec: { lengthIn: 30 }, dueOn: addDays(today, 61), dueKind: 'replacement' });
    // ^ one day past the company's "due soon" window (60 days unless the company sets its own): no reminder yet.
    // Due for inspection only: that is what the annual service is for, so no reminder of its own.
    await insertComponent(ctx.db, { companyId: id, applianceId: b.partDue.id, typeCode: 'gauge_glass', dueOn: addDays(today, 3), dueKind: 'inspection' });
    b.removed = await boiler(id, c.agnes, { annualMonthsAgo: [30], status: 'removed' });
    b.optedOut = await boiler(id, c.optedOut, { annualMonthsAgo: [13] });
    b.noEmail = await boiler(id, c.noEmail, { annualMonthsAgo: [13] });
    b.upToDate = await boiler(id, c.upToDate, { annualMonthsAgo: [3] });
    b.oneClick = await boiler(id, c.oneClick, { annualMonthsAgo: [18] });
    const [cat] = await ctx.db.select().from(componentCatalog).where(and(eq(componentCatalog.companyId, id), eq(componentCatalog.code, 'thermocouple')));
    thermocoupleLabel = `${cat.label}, 24 in`;
  });

  it('records each due reminder once and sends each customer one e-mail listing theirs', async () => {
    const outcome = await runReminders(ctx, { companyId: t.company.id });
    expect(outcome).toMatchObject({ created: 5, retried: 0, sent: 3, opted_out: 1, no_email: 1, failed: 0, emails: 2 });

    const rows = await rowsOf(t.company.id);
    const byAppliance = (applianceId: string) => rows.filter((r) => r.applianceId === applianceId);
    expect(byAppliance(b.lapsed.id)).toEqual([
      expect.objectContaining({ kind: 'annual_service', partKey: '', dueOn: b.lapsed.annualDueOn, status: 'sent', trigger: 'schedule', toEmail: c.agnes.email, attempts: 1 }),
    ]);
    expect(byAppliance(b.partDue.id)).toEqual([
      expect.objectContaining({ kind: 'part_due', dueOn: addDays(today, 10), partLabel: thermocoupleLabel, status: 'sent', toEmail: c.agnes.email }),
    ]);
    expect(byAppliance(b.optedOut.id)).toEqual([expect.objectContaining({ status: 'opted_out', toEmail: null, attempts: 0 })]);
    expect(byAppliance(b.noEmail.id)).toEqual([expect.objectContaining({ status: 'no_email', attempts: 0 })]);
    expect(byAppliance(b.removed.id)).toEqual([]);
    expect(byAppliance(b.upToDate.id)).toEqual([]);

    for (const appliance of [b.lapsed, b.partDue, b.optedOut, b.noEmail]) {
      const events = await reminderEvents(appliance.id);
      expect(events).toHaveLength(1);
      expect(events[0].refId).toBe(rows.find((r) => r.applianceId === appliance.id)!.id);
    }
    expect((await reminderEvents(b.optedOut.id))[0].summary).toMatch(/opted out/);

    expect(mailTo(c.agnes.email!)).toHaveLength(1);
    expect(mailTo(c.optedOut.email!)).toHaveLength(0);
    expect(mailTo(c.upToDate.email!)).toHaveLength(0);
    expect(mailTo(c.oneClick.email!)).toHaveLength(1);
  });

  it('e-mails plain words in a text and an HTML part, with the company, the safety line and RFC 8058 headers', async () => {
    const [mail] = await parsedMailTo(c.agnes.email!);
    expect(mail.to).toMatchObject({ value: [{ address: c.agnes.email }] });
    expect(mail.subject).toContain(t.company.name);
    for (const part of [mail.text!, String(mail.html)]) {
      expect(part).toContain(t.company.phone);
      expect(part).toContain(thermocoupleLabel);
      expect(part).toMatch(/yearly service was due/);
      expect(part).toMatch(/carbon monoxide \(CO\) alarms/);
      expect(part).toMatch(/If you smell gas, leave the building/);
      expect(part).toMatch(/licensed professionals/);
    }
    expect(headerLine(mail, 'list-unsubscribe-post')).toBe('List-Unsubscribe-Post: List-Unsubscribe=One-Click');
    expect(headerLine(mail, 'list-unsubscribe')).toMatch(/^List-Unsubscribe: <http:\/\/127\.0\.0\.1:3999\/api\/unsubscribe\/[^>]+>$/);
  });

  it('a second run sends nothing more and records nothing twice', async () => {
    const before = (await rowsOf(t.company.id)).length;
    const outcome = await runReminders(ctx, { companyId: t.company.id });
    expect(outcome).toMatchObject({ created: 0, retried: 0, emails: 0 });
    expect(await rowsOf(t.company.id)).toHaveLength(before);
    expect(mailTo(c.agnes.email!)).toHaveLength(1);
    expect(await reminderEvents(b.lapsed.id)).toHaveLength(1);
  });

  it('a reminder held back for lack of an address goes out once the customer has one, and only once', async () => {
    const address = uniqueEmail();
    await ctx.db.update(customers).set({ email: address }).where(eq(customers.id, c.noEmail.id));
    expect(await runReminders(ctx, { companyId: t.company.id })).toMatchObject({ created: 0, retried: 1, sent: 1, emails: 1 });
    const rows = (await rowsOf(t.company.id)).filter((r) => r.applianceId === b.noEmail.id);
    expect(rows).toEqual([expect.objectContaining({ status: 'sent', toEmail: address, attempts: 1 })]);
    expect(mailTo(address)).toHaveLength(1);
    expect(await runReminders(ctx, { companyId: t.company.id })).toMatchObject({ created: 0, retried: 0, emails: 0 });
    expect(mailTo(address)).toHaveLength(1);
    // The opted-out customer is still opted out: their row stays as it was.
    expect((await rowsOf(t.company.id)).filter((r) => r.applianceId === b.optedOut.id)).toEqual([expect.objectContaining({ status: 'opted_out' })]);
  });

  it('the database itself refuses a second row for the same appliance, kind, part and due date', async () => {
    const [row] = (await rowsOf(t.company.id)).filter((r) => r.applianceId === b.lapsed.id);
    const duplicate = ctx.db.insert(reminders).values({
      companyId: row.companyId,
      applianceId: row.applianceId,
      customerId: row.customerId,
      kind: row.kind,
      partKey: row.partKey,
      dueOn: row.dueOn,
      trigger: 'office',
    });
    const err = await duplicate.then(() => null, (e: { code?: string; cause?: { code?: string } }) => e);
    expect(err?.code ?? err?.cause?.code).toBe('23505');
  });

  it('the e-mail’s unsubscribe link works without signing in, and the next run sends that customer nothing', async () => {
    const [mail] = await parsedMailTo(c.agnes.email!);
    const link = unsubscribeLink(mail)!;
    expect(link).toMatch(/^http:\/\/127\.0\.0\.1:3999\/unsubscribe\/[^/]+$/);
    const token = link.split('/').at(-1)!;

    const status = await request(app).get(`/api/unsubscribe/${token}`);
    expect(status.status).toBe(200);
    expect(status.body).toEqual({ companyName: t.company.name, companyPhone: t.company.phone, optedOut: false });
    const done = await request(app).post(`/api/unsubscribe/${token}`);
    expect(done.status).toBe(200);
    expect(done.body.optedOut).toBe(true);
    const [stored] = await ctx.db.select().from(customers).where(eq(customers.id, c.agnes.id));
    expect(stored.remindersOptOut).toBe(true);
    const audits = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entity, 'customer'), eq(auditLog.entityId, c.agnes.id)));
    expect(audits).toEqual([expect.objectContaining({ actorId: null, action: 'update' })]);

    // A new part falls due for the same customer: recorded, not sent.
    const part = await insertComponent(ctx.db, { companyId: t.company.id, applianceId: b.partDue.id, typeCode: 'flame_sensor', dueOn: addDays(today, 5), dueKind: 'replacement' });
    const outcome = await runReminders(ctx, { companyId: t.company.id });
    expect(outcome).toMatchObject({ created: 1, emails: 0, opted_out: 1 });
    const [row] = (await rowsOf(t.company.id)).filter((r) => r.partKey === part.id);
    expect(row.status).toBe('opted_out');
    expect(mailTo(c.agnes.email!)).toHaveLength(1);
  });

  it('a mail program’s one-click POST to the List-Unsubscribe address opts the customer out', async () => {
    const [mail] = await parsedMailTo(c.oneClick.email!);
    const url = /<([^>]+)>/.exec(String(headerLine(mail, 'list-unsubscribe')))![1];
    const res = await request(app).post(new URL(url).pathname).type('form').send('List-Unsubscribe=One-Click');
    expect(res.status).toBe(200);
    const [stored] = await ctx.db.select().from(customers).where(eq(customers.id, c.oneClick.id));
    expect(stored.remindersOptOut).toBe(true);
  });

  it('a forged, altered or unknown token answers 404 and says nothing about anyone', async () => {
    const [mail] = await parsedMailTo(c.oneClick.email!);
    const token = unsubscribeLink(mail)!.split('/').at(-1)!;
    const [customerId, signature] = token.split('.');
    const altered = `${customerId}.${signature.slice(0, -2)}${signature.endsWith('AA') ? 'BB' : 'AA'}`;
    const otherCustomer = `${c.upToDate.id}.${signature}`;
    for (const bad of [altered, otherCustomer, customerId, 'nonsense', `${crypto.randomUUID()}.${signature}`]) {
      for (const method of ['get', 'post'] as const) {
        const res = await request(app)[method](`/api/unsubscribe/${encodeURIComponent(bad)}`);
        expect({ bad, method, status: res.status }).toEqual({ bad, method, status: 404 });
        expect(JSON.stringify(res.body)).not.toContain(t.company.name);
      }
    }
    const [stored] = await ctx.db.select().from(customers).where(eq(customers.id, c.upToDate.id));
    expect(stored.remindersOptOut).toBe(false);
  });
});

describe('a failed send', () => {
  it('is marked failed with the error, and a later run retries the same row', async () => {
    const company = await insertCompany(ctx.db);
    const owner = await customer(company.id);
    const a = await boiler(company.id, owner, { annualMonthsAgo: [15] });
    const broken: AppContext = { ...ctx, mailer: { send: () => Promise.reject(new Error('SMTP refused the connection')), close: () => {} } };

    expect(await runReminders(broken, { companyId: company.id })).toMatchObject({ created: 1, failed: 1, emails: 0 });
    let rows = await rowsOf(company.id);
    expect(rows).toEqual([expect.objectContaining({ status: 'failed', attempts: 1, lastError: 'SMTP refused the connection', sentAt: null })]);

    expect(await runReminders(ctx, { companyId: company.id })).toMatchObject({ created: 0, retried: 1, sent: 1, emails: 1 });
    rows = await rowsOf(company.id);
    expect(rows).toEqual([expect.objectContaining({ id: rows[0].id, status: 'sent', attempts: 2, lastError: null, toEmail: owner.email })]);
    expect(mailTo(owner.email!)).toHaveLength(1);
    expect((await reminderEvents(a.id)).map((e) => e.data)).toEqual(
      expect.arrayContaining([expect.objectContaining({ status: 'failed' }), expect.objectContaining({ status: 'sent' })]),
    );

    expect(await runReminders(ctx, { companyId: company.id })).toMatchObject({ created: 0, retried: 0, emails: 0 });
    expect(mailTo(owner.email!)).toHaveLength(1);
  });
});

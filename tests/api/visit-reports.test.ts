import { and, eq } from 'drizzle-orm';
import { PDFDocument } from 'pdf-lib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { auditLog, components, customers, outgoingMail, shareLinks } from '../../server/db/schema/index';
import { recomputeDueForAppliance } from '../../server/modules/due/due.repository';
import { testApp } from '../support/context';
import { parsedMailTo, uniqueEmail } from '../support/outbox';
import { pdfPageText } from '../support/pdf-text';
import { runFileAt } from '../support/clock';
import { agentsFor, createTenant, type Agent, type Tenant } from '../support/tenant';
import { fullCompletion } from '../support/visit-completion';
import { VISIT_STEPS } from '../../shared/glossary/visit-steps';

const { app, ctx } = testApp();
runFileAt('2026-11-18T12:00:00-05:00');
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherAs: Awaited<ReturnType<typeof agentsFor>>;
let email: string;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  otherAs = await agentsFor(app, other);
  email = uniqueEmail();
  await ctx.db.update(customers).set({ email, remindersOptOut: false }).where(eq(customers.id, t.customer.id));
});
afterAll(() => ctx.pool.end());

async function boilerWithThermocouple(tenant: Tenant) {
  const site = await insertSite(ctx.db, { companyId: tenant.company.id, customerId: tenant.customer.id, street: '9 Larch Row', town: 'Wrenfield' });
  const appliance = await insertAppliance(ctx.db, { companyId: tenant.company.id, siteId: site.id, kind: 'hot_water_boiler', fuel: 'natural_gas', installedOn: '2012-10-01' });
  const [tc] = await ctx.db
    .insert(components)
    .values({ companyId: tenant.company.id, applianceId: appliance.id, typeCode: 'thermocouple', spec: { lengthIn: 24 }, specKey: '24 in', installedOn: '2019-06-01' })
    .returning();
  await recomputeDueForAppliance(ctx.db, tenant.company.id, appliance.id);
  return { applianceId: appliance.id, thermocoupleId: tc.id };
}

async function completedVisit(agent: Agent, applianceId: string, overrides: Parameters<typeof fullCompletion>[1] = {}, swapId?: string) {
  const started = await agent.post('/api/visits').send({ applianceId, type: 'annual_maintenance' });
  expect(started.status).toBe(200);
  let visit = started.body;
  if (swapId) {
    const swap = await agent.post(`/api/visits/${visit.id}/swaps`).send({ componentId: swapId, reason: 'Weak output', newDescription: 'thermocouple, 24 in' });
    expect(swap.status).toBe(200);
    visit = swap.body;
  }
  const done = await agent.post(`/api/visits/${visit.id}/complete`).send(fullCompletion(visit, { findings: 'Cleaned the burners and tested the controls.', ...overrides }));
  expect(done.status).toBe(200);
  return done.body as { id: string };
}

const pdfText = async (bytes: Buffer) => {
  const doc = await PDFDocument.load(bytes);
  return doc.getPages().map(pdfPageText).join('\n').replace(/\n/g, ' ');
};
const binary = (r: import('supertest').Request) =>
  r.buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });

describe('visit report on completion', () => {
  it('e-mails the customer the report with the PDF attached and a working share link, and audits it', async () => {
    const { applianceId, thermocoupleId } = await boilerWithThermocouple(t);
    const visit = await completedVisit(as.technician, applianceId, {}, thermocoupleId);

    const [row] = await ctx.db.select().from(outgoingMail).where(and(eq(outgoingMail.kind, 'visit_report'), eq(outgoingMail.refId, visit.id)));
    expect(row).toMatchObject({ companyId: t.company.id, status: 'sent', sealed: null });
    const [mail] = await parsedMailTo(email);
    expect(mail.subject).toMatch(/^Your visit report, November 18, 2026: /);
    // GOOD_COMBUSTION: 50 ppm CO at 7 % O2 is 50 × 20.9 / (20.9 − 7) ≈ 75 ppm air-free (the air-free formula in shared/trade/combustion.ts).
    expect(mail.text).toContain('Carbon monoxide in the flue: 75 ppm air-free, well under the 400 ppm limit.');
    expect(mail.text).toContain('Outcome: Left operating.');
    expect(mail.headers.get('x-lifeplate-company')).toBe(t.company.id);
    expect(mail.attachments).toHaveLength(1);
    expect(mail.attachments[0]).toMatchObject({ contentType: 'application/pdf', filename: 'visit-report-2026-11-18.pdf' });
    const text = await pdfText(mail.attachments[0].content);
    expect(text).toContain('Visit report: Annual maintenance, November 18, 2026');
    expect(text).toContain('Outcome: Left operating');
    expect(text).toContain('Carbon monoxide in the flue: 75 ppm air-free, well under the 400 ppm limit.');
    // The thermocouple fitted 2019-06-01 and swapped on 2026-11-18: 7 whole years.
    expect(text).toContain('Thermocouple (new: thermocouple, 24 in): the old one was 7 years old; reason: Weak output.');
    expect(text).toContain('Next yearly service: November 18, 2027.');
    // Each checked step with its plain line from the glossary (shared/glossary/visit-steps.ts), then its items.
    expect(text).toContain('What we checked');
    expect(text.replace(/\s+/g, ' ')).toContain(`Carbon monoxide: ${VISIT_STEPS['Carbon monoxide']}`);
    expect(text).not.toContain('(carbon monoxide)');
    expect(text).toMatch(/manufacturer's instructions and local codes/);

    const shareUrl = /https?:\/\/\S+\/s\/([A-Za-z0-9_-]{43})/.exec(mail.text ?? '')!;
    expect(shareUrl).not.toBeNull();
    const view = await as.anonymous.get(`/api/share/${shareUrl[1]}`);
    expect(view.status).toBe(200);
    expect(view.body.visits[0].id).toBe(visit.id);
    const links = await ctx.db.select().from(shareLinks).where(eq(shareLinks.applianceId, applianceId));
    expect(links).toHaveLength(1);
    const audits = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entityId, visit.id), eq(auditLog.action, 'visit_report_mailed')));
    expect(audits).toEqual([expect.objectContaining({ companyId: t.company.id, actorId: t.technician.user.id, changes: { mailId: row.id } })]);
  });

  it('a visit shut down as unsafe says so first, with what the household must do', async () => {
    const { applianceId } = await boilerWithThermocouple(t);
    const visit = await completedVisit(as.technician, applianceId, {
      outcome: 'shut_down_unsafe',
      outcomeReason: 'Flue blocked by a collapsed liner.',
      outcomeToldWhom: 'Occupant',
    });
    const res = await binary(as.manager.get(`/api/visits/${visit.id}/report`));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const text = await pdfText(res.body as Buffer);
    expect(text.indexOf('This appliance was shut down as unsafe and must not be used.')).toBe(0);
    expect(text).toContain('Why: Flue blocked by a collapsed liner.');
    expect(text).toContain('Do not turn it back on, relight it');
    const mails = (await parsedMailTo(email)).filter((m) => m.subject?.startsWith('Important:'));
    expect(mails).toHaveLength(1);
    expect(mails[0].text!.startsWith('This appliance was shut down as unsafe')).toBe(true);
  });

  it('sends nothing to a customer who opted out, and says why when the office asks to resend', async () => {
    const optedOut = await createTenant(ctx.db);
    const theirs = await agentsFor(app, optedOut);
    const address = uniqueEmail();
    await ctx.db.update(customers).set({ email: address, remindersOptOut: true }).where(eq(customers.id, optedOut.customer.id));
    const { applianceId } = await boilerWithThermocouple(optedOut);
    const visit = await completedVisit(theirs.technician, applianceId);
    expect(await ctx.db.select().from(outgoingMail).where(eq(outgoingMail.refId, visit.id))).toHaveLength(0);
    const again = await theirs.manager.post(`/api/visits/${visit.id}/report/email`);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toBe('This customer has opted out of e-mails from us.');
    expect(await ctx.db.select().from(outgoingMail).where(eq(outgoingMail.refId, visit.id))).toHaveLength(0);
    expect(await parsedMailTo(address)).toHaveLength(0);
  });
});

describe('visit report downloads', () => {
  it('the office resends on request; the homeowner downloads it signed in and through the share link', async () => {
    const { applianceId } = await boilerWithThermocouple(t);
    const visit = await completedVisit(as.technician, applianceId);
    const before = (await parsedMailTo(email)).length;
    const resent = await as.manager.post(`/api/visits/${visit.id}/report/email`);
    expect(resent.status).toBe(200);
    expect(resent.body).toEqual({ mail: 'sent' });
    expect(await parsedMailTo(email)).toHaveLength(before + 1);

    const mine = await binary(as.homeowner.get(`/api/homeowner/appliances/${applianceId}/visits/${visit.id}/report`));
    expect(mine.status).toBe(200);
    expect(await pdfText(mine.body as Buffer)).toContain('9 Larch Row, Wrenfield');

    const link = await as.technician.post(`/api/appliances/${applianceId}/share-links`).send({});
    const token = link.body.url.split('/s/')[1];
    const shared = await binary(as.anonymous.get(`/api/share/${token}/visits/${visit.id}/report`));
    expect(shared.status).toBe(200);
    expect(shared.headers['content-disposition']).toBe('attachment; filename="visit-report-2026-11-18.pdf"');
  });

  it('shows the visit as its amendments corrected it, and says it was corrected', async () => {
    const { applianceId } = await boilerWithThermocouple(t);
    const visit = await completedVisit(as.technician, applianceId);
    const amended = await as.manager.post(`/api/visits/${visit.id}/amendments`).send({ reason: 'Findings were typed on the wrong visit.', findings: 'Replaced the pilot assembly gasket.' });
    expect(amended.status).toBe(200);
    const text = await pdfText((await binary(as.manager.get(`/api/visits/${visit.id}/report`))).body as Buffer);
    expect(text).toContain('What was done: Replaced the pilot assembly gasket.');
    expect(text).not.toContain('Cleaned the burners and tested the controls.');
    expect(text).toContain('Corrected after the visit: Findings were typed on the wrong visit.');
  });

  it('answers 401 signed out, 403 to a homeowner on the office route, 404 across tenants and appliances, 400 for a bad id', async () => {
    const { applianceId } = await boilerWithThermocouple(t);
    const visit = await completedVisit(as.technician, applianceId);
    const elsewhere = await boilerWithThermocouple(t);
    expect((await as.anonymous.get(`/api/visits/${visit.id}/report`)).status).toBe(401);
    expect((await as.anonymous.post(`/api/visits/${visit.id}/report/email`)).status).toBe(401);
    expect((await as.homeowner.get(`/api/visits/${visit.id}/report`)).status).toBe(403);
    expect((await otherAs.manager.get(`/api/visits/${visit.id}/report`)).status).toBe(404);
    expect((await otherAs.manager.post(`/api/visits/${visit.id}/report/email`)).status).toBe(404);
    expect((await otherAs.homeowner.get(`/api/homeowner/appliances/${applianceId}/visits/${visit.id}/report`)).status).toBe(404);
    // A visit of another appliance through this appliance's link or record: 404, nothing about it.
    const link = await as.technician.post(`/api/appliances/${elsewhere.applianceId}/share-links`).send({});
    const token = link.body.url.split('/s/')[1];
    expect((await as.anonymous.get(`/api/share/${token}/visits/${visit.id}/report`)).status).toBe(404);
    expect((await as.homeowner.get(`/api/homeowner/appliances/${elsewhere.applianceId}/visits/${visit.id}/report`)).status).toBe(404);
    const bad = await as.manager.get('/api/visits/not-a-uuid/report');
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details)).toEqual(['id']);
    // A draft has no report yet.
    const draft = await as.technician.post('/api/visits').send({ applianceId: elsewhere.applianceId, type: 'annual_maintenance' });
    expect((await as.manager.get(`/api/visits/${draft.body.id}/report`)).status).toBe(404);
  });
});

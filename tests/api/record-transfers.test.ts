import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { appliances, auditLog, components, customers, partSwaps, photos, recordTransfers, sites, timelineEvents, visitAmendments, visits } from '../../server/db/schema/index';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { hashTransferCode } from '../../server/modules/record-transfers/record-transfers.service';
import { TRANSFER_CODE_DAYS } from '../../shared/schemas/record-transfers';
import type { VisitDto } from '../../shared/schemas/visits';
import { runFileAt } from '../support/clock';
import { testApp } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';
import { fullCompletion } from '../support/visit-completion';

runFileAt('2027-02-03T10:00:00-05:00');

const { app, ctx } = testApp();
let sender: Tenant;
let receiver: Tenant;
let from: Awaited<ReturnType<typeof agentsFor>>;
let to: Awaited<ReturnType<typeof agentsFor>>;
let boilerId: string;
let oldPartId: string;
const SECRET_NOTE = 'Office only: gate code 4471';
const CODE_SHAPE = /^[0-9A-HJKMNP-TV-Z]{4}(-[0-9A-HJKMNP-TV-Z]{4}){3}$/;

async function jpeg(shade: number) {
  return sharp({ create: { width: 40, height: 30, channels: 3, background: { r: shade, g: shade, b: shade } } }).jpeg().toBuffer();
}

beforeAll(async () => {
  sender = await createTenant(ctx.db);
  receiver = await createTenant(ctx.db);
  [from, to] = await Promise.all([agentsFor(app, sender), agentsFor(app, receiver)]);
  const site = await insertSite(ctx.db, { companyId: sender.company.id, customerId: sender.customer.id, street: '14 Tannery Row', town: 'Ebbsworth', accessNotes: SECRET_NOTE });
  const boiler = await insertAppliance(ctx.db, {
    companyId: sender.company.id,
    siteId: site.id,
    manufacturer: 'Harrowgate Foundry',
    model: 'HF-4',
    components: [{ typeCode: 'thermocouple', installedOn: '2019-05-01', spec: { lengthIn: 24 } }],
  });
  boilerId = boiler.id;
  oldPartId = boiler.components[0].id;
  // A second appliance at the same site, which no code names.
  await insertAppliance(ctx.db, { companyId: sender.company.id, siteId: site.id });

  // A repair with a part swap, completed, then amended; and a photo the homeowner sees beside one only the office sees.
  const started = (await from.owner.post('/api/visits').send({ applianceId: boilerId, type: 'repair' })).body as VisitDto;
  const swap = await from.owner.post(`/api/visits/${started.id}/swaps`).send({ componentId: oldPartId, reason: 'no flame signal', cause: 'wear_or_failure', newSpec: { lengthIn: 24 } });
  expect(swap.status).toBeLessThan(300);
  const current = (await from.owner.get(`/api/visits/${started.id}`)).body as VisitDto;
  const done = await from.owner.post(`/api/visits/${started.id}/complete`).send(fullCompletion(current, { findings: 'Replaced the thermocouple.', internalNotes: SECRET_NOTE }));
  expect(done.status).toBe(200);
  const amended = await from.owner.post(`/api/visits/${started.id}/amendments`).send({ reason: 'Spelling of the finding', findings: 'Replaced the thermocouple; flame steady.' });
  expect(amended.status).toBeLessThan(300);
  for (const [visible, shade] of [
    ['true', 90],
    ['false', 140],
  ] as const) {
    const up = await from.owner
      .post('/api/photos')
      .field('applianceId', boilerId)
      .field('visitId', started.id)
      .field('kind', 'nameplate')
      .field('homeownerVisible', visible)
      .attach('files', await jpeg(shade), { filename: 'p.jpg', contentType: 'image/jpeg' });
    expect(up.status).toBe(201);
  }
  // A draft is work in progress: it never travels.
  await from.owner.post('/api/visits').send({ applianceId: boilerId, type: 'annual_maintenance' });
});
afterAll(() => ctx.pool.end());

const makeCode = async () => {
  const res = await from.manager.post(`/api/appliances/${boilerId}/record-transfers`);
  expect(res.status).toBe(201);
  return res.body as { id: string; code: string; expiresAt: string; status: string };
};
const rowsOf = async (companyId: string, applianceId: string) => ({
  appliance: (await ctx.db.select().from(appliances).where(and(eq(appliances.companyId, companyId), eq(appliances.id, applianceId))))[0],
  parts: await ctx.db.select().from(components).where(eq(components.applianceId, applianceId)),
  visits: await ctx.db.select().from(visits).where(eq(visits.applianceId, applianceId)),
  swaps: await ctx.db.select().from(partSwaps).where(eq(partSwaps.applianceId, applianceId)),
  photos: await ctx.db.select().from(photos).where(eq(photos.applianceId, applianceId)),
});

describe('making a transfer code', () => {
  it('gives the code once, 80 bits in four groups, keeps only its hash, expiring in 14 days', async () => {
    const before = Date.now();
    const made = await makeCode();
    const after = Date.now();
    expect(made.code).toMatch(CODE_SHAPE);
    expect(made.status).toBe('open');
    const span = TRANSFER_CODE_DAYS * 86_400_000;
    expect(Date.parse(made.expiresAt)).toBeGreaterThanOrEqual(before + span);
    expect(Date.parse(made.expiresAt)).toBeLessThanOrEqual(after + span);
    const [row] = await ctx.db.select().from(recordTransfers).where(eq(recordTransfers.id, made.id));
    expect(row).toMatchObject({ companyId: sender.company.id, applianceId: boilerId, madeBy: 'office', codeHash: hashTransferCode(made.code.replaceAll('-', '')), redeemedAt: null });
    expect(JSON.stringify(row)).not.toContain(made.code.replaceAll('-', ''));
    const [audit] = await ctx.db.select().from(auditLog).where(and(eq(auditLog.companyId, sender.company.id), eq(auditLog.entityId, made.id)));
    expect(audit).toMatchObject({ action: 'create', entity: 'record_transfer', actorId: sender.manager.user.id });
    const listed = await from.owner.get(`/api/appliances/${boilerId}/record-transfers`);
    expect(listed.body.map((t: { id: string }) => t.id)).toContain(made.id);
    expect(JSON.stringify(listed.body)).not.toContain(made.code);
  });

  it('lets the homeowner make one for their own appliance, and answers 404 for anyone else’s', async () => {
    const res = await from.homeowner.post(`/api/homeowner/appliances/${boilerId}/record-transfers`);
    expect(res.status).toBe(201);
    expect(res.body.code).toMatch(CODE_SHAPE);
    const [row] = await ctx.db.select().from(recordTransfers).where(eq(recordTransfers.id, res.body.id));
    expect(row).toMatchObject({ madeBy: 'homeowner', createdBy: sender.homeowner.user.id });
    // The receiving company's homeowner names the sender's boiler.
    expect((await to.homeowner.post(`/api/homeowner/appliances/${boilerId}/record-transfers`)).status).toBe(404);
    // The homeowner withdraws their own code; another homeowner cannot.
    expect((await to.homeowner.post(`/api/homeowner/record-transfers/${res.body.id}/withdraw`)).status).toBe(404);
    const withdrawn = await from.homeowner.post(`/api/homeowner/record-transfers/${res.body.id}/withdraw`);
    expect(withdrawn.body.status).toBe('withdrawn');
  });

  it('is for owners and managers only; another company’s appliance is 404; signed out is 401', async () => {
    expect((await from.technician.post(`/api/appliances/${boilerId}/record-transfers`)).status).toBe(403);
    expect((await to.owner.post(`/api/appliances/${boilerId}/record-transfers`)).status).toBe(404);
    expect((await from.anonymous.post(`/api/appliances/${boilerId}/record-transfers`)).status).toBe(401);
    expect((await from.owner.post('/api/appliances/not-an-id/record-transfers')).status).toBe(400);
    const before = await ctx.db.select().from(recordTransfers).where(eq(recordTransfers.companyId, receiver.company.id));
    expect(before).toHaveLength(0);
  });
});

describe('receiving a record', () => {
  it('previews what will be copied, then copies it into the receiving company only, marked with where it came from', async () => {
    const made = await makeCode();
    // Typed loosely: lower case, spaces, an O for a 0 and an I or L for a 1 still read as the code.
    const typed = made.code.toLowerCase().replaceAll('-', ' ').replaceAll('0', 'o').replaceAll('1', 'l');
    const preview = await to.manager.post('/api/record-transfers/preview').send({ code: typed });
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({
      senderName: sender.company.name,
      homeownerName: sender.customer.name,
      address: { street: '14 Tannery Row', town: 'Ebbsworth' },
      counts: { components: 2, visits: 1, partSwaps: 1, photos: 1 },
    });
    expect(preview.body.appliance.label).toContain('Harrowgate Foundry HF-4');
    expect(JSON.stringify(preview.body)).not.toContain(SECRET_NOTE);

    const res = await to.manager.post('/api/record-transfers/redeem').send({ code: made.code });
    expect(res.status).toBe(201);
    expect(res.body.counts).toEqual({ components: 2, visits: 1, partSwaps: 1, photos: 1 });
    const copy = await rowsOf(receiver.company.id, res.body.applianceId);
    const original = await rowsOf(sender.company.id, boilerId);
    expect(copy.appliance).toMatchObject({ manufacturer: 'Harrowgate Foundry', model: 'HF-4', serial: original.appliance!.serial, importedFromTransferId: made.id });
    // A new customer and site in the receiving company, from the homeowner's name and address; no access notes.
    const [site] = await ctx.db.select().from(sites).where(eq(sites.id, res.body.siteId));
    expect(site).toMatchObject({ companyId: receiver.company.id, street: '14 Tannery Row', town: 'Ebbsworth', accessNotes: null });
    const [customer] = await ctx.db.select().from(customers).where(eq(customers.id, res.body.customerId));
    expect(customer).toMatchObject({ companyId: receiver.company.id, name: sender.customer.name });
    // Parts, the completed visit (never the draft), the swap and the homeowner's photo, all the receiver's, all marked.
    expect(copy.parts).toHaveLength(2);
    expect(copy.visits).toHaveLength(1);
    expect(copy.swaps).toHaveLength(1);
    expect(copy.photos).toHaveLength(1);
    for (const row of [...copy.parts, ...copy.visits, ...copy.swaps, ...copy.photos]) {
      expect(row).toMatchObject({ companyId: receiver.company.id, importedFromTransferId: made.id });
    }
    const [visit] = copy.visits;
    const [sourceVisit] = original.visits.filter((v) => v.status === 'completed');
    // The finding as signed off; its correction travels as the amendment beside it (amendments-only).
    expect(visit).toMatchObject({ status: 'completed', findings: 'Replaced the thermocouple.', internalNotes: '', technicianIds: [], signedOffBy: null, outcome: 'left_operating' });
    expect(visit!.readings).toEqual(sourceVisit!.readings);
    expect(visit!.checklist.every((i) => i.note === '')).toBe(true);
    const [swap] = copy.swaps;
    expect(swap).toMatchObject({ visitId: visit!.id, cause: 'wear_or_failure', reason: 'no flame signal' });
    const removed = copy.parts.find((p) => p.id === swap!.removedComponentId)!;
    expect(removed.replacedById).toBe(swap!.newComponentId);
    expect(removed.removedOn).not.toBeNull();
    const amendments = await ctx.db.select().from(visitAmendments).where(eq(visitAmendments.visitId, visit!.id));
    expect(amendments).toMatchObject([{ companyId: receiver.company.id, reason: 'Spelling of the finding', createdBy: null }]);
    expect(JSON.stringify(amendments[0]!.changes)).toContain('flame steady');
    // The photo's bytes were copied to the receiver's keys; the sender's objects stay where they were.
    const [photo] = copy.photos;
    expect(photo!.displayKey.startsWith(`${receiver.company.id}/${res.body.applianceId}/`)).toBe(true);
    expect(photo!.visitId).toBe(visit!.id);
    const source = original.photos.find((p) => p.homeownerVisible)!;
    expect((await ctx.storage.get(photo!.displayKey)).body.equals((await ctx.storage.get(source.displayKey)).body)).toBe(true);
    expect(original.photos).toHaveLength(2);

    // The sender keeps its record; its code is used; both audit logs say what happened.
    expect(original.visits.filter((v) => v.status === 'completed')).toHaveLength(1);
    const [transfer] = await ctx.db.select().from(recordTransfers).where(eq(recordTransfers.id, made.id));
    expect(transfer).toMatchObject({ redeemedByCompanyId: receiver.company.id, senderName: sender.company.name });
    expect(transfer!.redeemedAt).not.toBeNull();
    const sent = await ctx.db.select().from(auditLog).where(and(eq(auditLog.companyId, sender.company.id), eq(auditLog.action, 'transfer_sent')));
    expect(sent.map((a) => a.entityId)).toContain(made.id);
    expect(JSON.stringify(sent)).not.toContain(receiver.company.id);
    const received = await ctx.db.select().from(auditLog).where(and(eq(auditLog.companyId, receiver.company.id), eq(auditLog.entityId, res.body.applianceId)));
    expect(received).toMatchObject([{ action: 'transfer_received', actorId: receiver.manager.user.id }]);

    // The record and its visit say who recorded them, on the receiver's side.
    const record = await to.owner.get(`/api/appliances/${res.body.applianceId}`);
    expect(record.status).toBe(200);
    expect(record.body.transferredFrom).toEqual({ senderName: sender.company.name, receivedAt: transfer!.redeemedAt!.toISOString() });
    const visitDto = await to.owner.get(`/api/visits/${visit!.id}`);
    expect(visitDto.body.recordedElsewhere).toMatchObject({ senderName: sender.company.name });
    const events = await ctx.db.select().from(timelineEvents).where(eq(timelineEvents.applianceId, res.body.applianceId));
    expect(events.map((e) => e.kind).sort()).toEqual(['import', 'part_swap', 'visit']);
    expect(events.find((e) => e.kind === 'import')!.summary).toContain('Feb 3, 2027');
    expect(events.find((e) => e.kind === 'visit')!.summary).toContain('recorded by another company');

    // Nothing else crosses: each company still answers 404 for the other's records.
    expect((await to.owner.get(`/api/appliances/${boilerId}`)).status).toBe(404);
    expect((await from.owner.get(`/api/appliances/${res.body.applianceId}`)).status).toBe(404);
    expect((await from.owner.get(`/api/visits/${visit!.id}`)).status).toBe(404);

    // A copied visit is amendments-only, like any completed visit.
    const edit = await to.owner.put(`/api/visits/${visit!.id}/draft`).send({ revision: visit!.revision, findings: 'rewritten' });
    expect(edit.status).toBeGreaterThanOrEqual(400);
    expect(edit.status).toBeLessThan(500);
    const [still] = await ctx.db.select().from(visits).where(eq(visits.id, visit!.id));
    expect(still!.findings).toBe('Replaced the thermocouple.');
  });

  it('files the copy under a site of the receiver’s choosing; another company’s site is 404 and writes nothing', async () => {
    const own = await insertCustomer(ctx.db, { companyId: receiver.company.id, name: 'Corra Pellin' });
    const ownSite = await insertSite(ctx.db, { companyId: receiver.company.id, customerId: own.id });
    const made = await makeCode();
    const foreign = await to.owner.post('/api/record-transfers/redeem').send({ code: made.code, siteId: (await ctx.db.select().from(sites).where(eq(sites.companyId, sender.company.id)))[0]!.id });
    expect(foreign.status).toBe(404);
    expect((await ctx.db.select().from(recordTransfers).where(eq(recordTransfers.id, made.id)))[0]!.redeemedAt).toBeNull();
    const res = await to.owner.post('/api/record-transfers/redeem').send({ code: made.code, siteId: ownSite.id });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ siteId: ownSite.id, customerId: own.id });
    const [copy] = await ctx.db.select().from(appliances).where(eq(appliances.id, res.body.applianceId));
    expect(copy).toMatchObject({ companyId: receiver.company.id, siteId: ownSite.id });
  });

  it('answers a used code with a field-level 400 and copies nothing more', async () => {
    const made = await makeCode();
    expect((await to.owner.post('/api/record-transfers/redeem').send({ code: made.code })).status).toBe(201);
    const count = (await ctx.db.select().from(appliances).where(eq(appliances.companyId, receiver.company.id))).length;
    const again = await to.owner.post('/api/record-transfers/redeem').send({ code: made.code });
    expect(again.status).toBe(400);
    expect(again.body.error.details.code[0]).toMatch(/already been used/);
    expect((await to.owner.post('/api/record-transfers/preview').send({ code: made.code })).status).toBe(400);
    expect((await ctx.db.select().from(appliances).where(eq(appliances.companyId, receiver.company.id))).length).toBe(count);
  });

  it('copies once when two redemptions arrive at the same moment', async () => {
    const made = await makeCode();
    const third = await createTenant(ctx.db);
    const thirdAs = await agentsFor(app, third);
    const results = await Promise.all([
      to.owner.post('/api/record-transfers/redeem').send({ code: made.code }),
      to.manager.post('/api/record-transfers/redeem').send({ code: made.code }),
      thirdAs.owner.post('/api/record-transfers/redeem').send({ code: made.code }),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([201, 400, 400]);
    const copies = await ctx.db.select().from(appliances).where(eq(appliances.importedFromTransferId, made.id));
    expect(copies).toHaveLength(1);
  });

  it('refuses an expired, a withdrawn, a wrong and an own code, each with a message on the code field', async () => {
    // Made a minute more than 14 days ago on the fixed clock (moving back keeps the sessions valid), redeemed now.
    const now = Date.now();
    vi.setSystemTime(now - TRANSFER_CODE_DAYS * 86_400_000 - 60_000);
    let expiring: Awaited<ReturnType<typeof makeCode>>;
    try {
      expiring = await makeCode();
    } finally {
      vi.setSystemTime(now);
    }
    const expired = await to.owner.post('/api/record-transfers/redeem').send({ code: expiring.code });
    expect(expired.status).toBe(400);
    expect(expired.body.error.details.code[0]).toMatch(/expired/);
    const withdrawn = await makeCode();
    expect((await from.technician.post(`/api/record-transfers/${withdrawn.id}/withdraw`)).status).toBe(403);
    expect((await to.owner.post(`/api/record-transfers/${withdrawn.id}/withdraw`)).status).toBe(404);
    expect((await from.owner.post(`/api/record-transfers/${withdrawn.id}/withdraw`)).body.status).toBe('withdrawn');
    const refused = await to.owner.post('/api/record-transfers/redeem').send({ code: withdrawn.code });
    expect(refused.status).toBe(400);
    expect(refused.body.error.details.code[0]).toMatch(/withdrawn/);

    const wrong = await to.owner.post('/api/record-transfers/redeem').send({ code: 'ZZZZ-ZZZZ-ZZZZ-ZZZZ' });
    expect(wrong.status).toBe(404);
    expect(wrong.body.error.details.code[0]).toMatch(/No record transfer has this code/);
    const malformed = await to.owner.post('/api/record-transfers/redeem').send({ code: 'UUUU' });
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.details.code[0]).toMatch(/16-character code/);
    expect((await to.owner.post('/api/record-transfers/redeem').send({})).body.error.details.code).toBeDefined();

    const mine = await makeCode();
    const own = await from.owner.post('/api/record-transfers/redeem').send({ code: mine.code });
    expect(own.status).toBe(400);
    expect(own.body.error.details.code[0]).toMatch(/your own company/);

    // None of these wrote a copy or used a code.
    for (const id of [expiring.id, withdrawn.id, mine.id]) {
      expect(await ctx.db.select().from(appliances).where(eq(appliances.importedFromTransferId, id))).toHaveLength(0);
      expect((await ctx.db.select().from(recordTransfers).where(eq(recordTransfers.id, id)))[0]!.redeemedAt).toBeNull();
    }
    // Withdrawing a used code is a conflict, never a silent change.
    const used = await makeCode();
    expect((await to.owner.post('/api/record-transfers/redeem').send({ code: used.code })).status).toBe(201);
    expect((await from.owner.post(`/api/record-transfers/${used.id}/withdraw`)).status).toBe(409);
  });

  it('leaves out a photo whose bytes are gone from storage, and copies the rest', async () => {
    const site = await insertSite(ctx.db, { companyId: sender.company.id, customerId: sender.customer.id });
    const heater = await insertAppliance(ctx.db, { companyId: sender.company.id, siteId: site.id, kind: 'water_heater' });
    const up = await from.owner
      .post('/api/photos')
      .field('applianceId', heater.id)
      .field('kind', 'nameplate')
      .field('homeownerVisible', 'true')
      .attach('files', await jpeg(60), { filename: 'p.jpg', contentType: 'image/jpeg' });
    expect(up.status).toBe(201);
    const [stored] = await ctx.db.select().from(photos).where(eq(photos.applianceId, heater.id));
    await ctx.storage.delete(stored!.displayKey);
    const made = (await from.owner.post(`/api/appliances/${heater.id}/record-transfers`)).body as { code: string };
    const res = await to.owner.post('/api/record-transfers/redeem').send({ code: made.code });
    expect(res.status).toBe(201);
    expect(res.body.counts.photos).toBe(0);
    expect(await ctx.db.select().from(photos).where(eq(photos.applianceId, res.body.applianceId))).toHaveLength(0);
  });

  it('lets only owners and managers receive; signed out is 401', async () => {
    const made = await makeCode();
    expect((await to.technician.post('/api/record-transfers/preview').send({ code: made.code })).status).toBe(403);
    expect((await to.technician.post('/api/record-transfers/redeem').send({ code: made.code })).status).toBe(403);
    expect((await to.homeowner.post('/api/record-transfers/redeem').send({ code: made.code })).status).toBe(403);
    expect((await to.anonymous.post('/api/record-transfers/redeem').send({ code: made.code })).status).toBe(401);
    expect((await ctx.db.select().from(recordTransfers).where(eq(recordTransfers.id, made.id)))[0]!.redeemedAt).toBeNull();
  });
});

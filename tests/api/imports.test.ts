import { and, count, eq, isNotNull } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appliances, auditLog, components, customers, importFiles, sites, timelineEvents, visits } from '../../server/db/schema/index';
import { SAMPLE_IMPORT_HEADERS, sampleImportRows, toCsv } from '../../server/db/factories/import-csv';
import type { ImportFileDto, ImportPreviewDto } from '../../shared/schemas/imports';
import { runFileAt } from '../support/clock';
import { testApp } from '../support/context';
import { eventually } from '../support/outbox';
import { agentsFor, createTenant, type Agent, type Tenant } from '../support/tenant';

runFileAt('2026-11-18T12:00:00-05:00');
const { app, ctx } = testApp();
let t: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherAs: Awaited<ReturnType<typeof agentsFor>>;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  otherAs = await agentsFor(app, await createTenant(ctx.db));
});
afterAll(() => ctx.pool.end());

const upload = (agent: Agent, body: Buffer | string, filename = 'customers.csv') =>
  agent.post('/api/imports').attach('file', Buffer.isBuffer(body) ? body : Buffer.from(body, 'utf8'), { filename, contentType: 'text/csv' });
const countOf = async (table: typeof customers | typeof sites | typeof appliances | typeof components | typeof visits) =>
  (await ctx.db.select({ n: count() }).from(table).where(eq(table.companyId, t.company.id)))[0].n;
const snapshot = async () => ({ customers: await countOf(customers), sites: await countOf(sites), appliances: await countOf(appliances), components: await countOf(components), visits: await countOf(visits) });
async function finished(id: string): Promise<ImportFileDto> {
  return eventually(async () => {
    const res = await as.manager.get(`/api/imports/${id}`);
    expect(res.status).toBe(200);
    return res.body.status === 'done' || res.body.status === 'failed' ? (res.body as ImportFileDto) : null;
  });
}

// 40 rows, of which rows 5 and 23 (spreadsheet rows 6 and 24) are broken, and rows 7 and 14 a second boiler of a customer.
const rows = sampleImportRows(40, { seed: 11, today: '2026-11-18' });
rows[4][13] = '13/31/2004';
rows[22][7] = 'heat pump';
rows[9][1] = "=cmd|' /C calc'!A0";
const file = toCsv(SAMPLE_IMPORT_HEADERS, rows);

describe('bringing a spreadsheet in', () => {
  let imported: ImportFileDto;

  it('keeps the uploaded file and guesses the columns', async () => {
    const res = await upload(as.manager, file);
    expect(res.status).toBe(201);
    imported = res.body;
    expect(imported).toMatchObject({ fileName: 'customers.csv', rowCount: 40, encoding: 'utf-8', status: 'uploaded' });
    expect(imported.mapping).toMatchObject({ customerName: 'Customer', siteStreet: 'Service Address', applianceKind: 'Equipment', fuel: 'Fuel Type' });
    const [row] = await ctx.db.select().from(importFiles).where(eq(importFiles.id, imported.id));
    expect(row.companyId).toBe(t.company.id);
    const stored = await ctx.storage.get(row.objectKey!);
    expect(stored.body.toString('utf8')).toBe(file);
  });

  it('previews without writing: the first rows in words, every error with row and column, the counts', async () => {
    const before = await snapshot();
    const res = await as.manager.post(`/api/imports/${imported.id}/preview`).send({ mapping: imported.mapping });
    expect(res.status).toBe(200);
    const preview = res.body as ImportPreviewDto;
    expect(preview.rows).toHaveLength(20);
    expect(preview.rows[0].customer).toContain('(new)');
    expect(preview.errorRows).toBe(2);
    expect(preview.errors.map((e) => [e.row, e.column])).toEqual([
      [6, 'Install Date'],
      [24, 'Equipment'],
    ]);
    expect(preview.errors[0].message).toBe("'13/31/2004' is not a date; use YYYY-MM-DD, MM/DD/YYYY or a month name such as Jan 6, 2004.");
    // 38 good rows; every seventh is a second appliance of the customer before it, at the same site.
    expect(preview.counts.appliances).toEqual({ create: 38, update: 0, skip: 0 });
    expect(preview.counts.customers.create).toBe(preview.counts.sites.create);
    expect(preview.counts.customers.create).toBeLessThan(38);
    expect(preview.counts.visits.create).toBe(76);
    expect(await snapshot()).toEqual(before);
  });

  it('imports the good rows, marks their history as imported and recomputes due dates', async () => {
    const before = await snapshot();
    const res = await as.manager.post(`/api/imports/${imported.id}/run`).send({ mapping: imported.mapping });
    // 40 rows: imported within the request.
    expect(res.status).toBe(200);
    const done = res.body as ImportFileDto;
    expect(done.status).toBe('done');
    expect(done.rowsDone).toBe(40);
    expect(done.summary).toMatchObject({ rows: 40, errorRows: 2, appliances: { create: 38, update: 0, skip: 0 }, visits: { create: 76, update: 0, skip: 0 } });
    const after = await snapshot();
    expect(after.appliances - before.appliances).toBe(38);
    expect(after.visits - before.visits).toBe(76);
    expect(after.customers - before.customers).toBe(done.summary!.customers.create);

    const [boiler] = await ctx.db.select().from(appliances).where(and(eq(appliances.companyId, t.company.id), eq(appliances.importId, imported.id))).limit(1);
    const events = await ctx.db.select().from(timelineEvents).where(eq(timelineEvents.applianceId, boiler.id));
    expect(events.find((e) => e.kind === 'import')?.summary).toMatch(/^Brought in from customers\.csv on Nov 18, 2026 \(row \d+\)\. Not in the file, so assumed until checked on a visit: construction, ignition, vent\.$/);
    expect(events.filter((e) => e.kind === 'visit').map((e) => e.summary)).toEqual(expect.arrayContaining([expect.stringMatching(/\(imported from customers\.csv\)$/)]));
    const history = await ctx.db.select().from(visits).where(eq(visits.applianceId, boiler.id));
    expect(history.every((v) => v.status === 'completed' && v.importId === imported.id)).toBe(true);
    const parts = await ctx.db.select().from(components).where(and(eq(components.applianceId, boiler.id), isNotNull(components.dueOn)));
    expect(parts.length).toBeGreaterThan(0);
    const [audit] = await ctx.db.select().from(auditLog).where(and(eq(auditLog.entity, 'import_file'), eq(auditLog.entityId, imported.id), eq(auditLog.action, 'import')));
    expect(audit.changes).toMatchObject({ fileName: 'customers.csv', errorRows: 2 });
    // A formula-looking name is stored as the text it is.
    expect((await ctx.db.select().from(customers).where(eq(customers.name, "=cmd|' /C calc'!A0"))).length).toBe(1);
  });

  it('creates nothing twice when the same file is run again, or uploaded again', async () => {
    const before = await snapshot();
    const again = await as.manager.post(`/api/imports/${imported.id}/run`).send({ mapping: imported.mapping });
    expect(again.status).toBe(200);
    const rerun = again.body as ImportFileDto;
    expect(rerun.summary).toMatchObject({ appliances: { create: 0, skip: 38 }, visits: { create: 0, skip: 76 }, parts: { create: 0 } });
    const second = await upload(as.manager, file, 'customers-again.csv');
    const run = await as.manager.post(`/api/imports/${second.body.id}/run`).send({ mapping: second.body.mapping });
    expect(run.status).toBe(200);
    expect((await finished(second.body.id)).summary).toMatchObject({ customers: { create: 0 }, sites: { create: 0 }, appliances: { create: 0 } });
    expect(await snapshot()).toEqual(before);
  });

  it('gives the rows with errors back as a CSV to fix, formulas neutralised', async () => {
    const res = await as.manager.get(`/api/imports/${imported.id}/errors.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toContain('text/csv');
    expect(res.headers['content-disposition']).toContain('customers-rows-to-fix.csv');
    const lines = res.text.replace(/^\uFEFF/, '').trim().split('\r\n');
    expect(lines).toHaveLength(3);
    expect(lines[0]).toBe(`${SAMPLE_IMPORT_HEADERS.join(',')},What to fix`);
    expect(lines[1]).toContain("row 6: Install Date: '13/31/2004' is not a date");
    expect(lines[2]).toContain("row 24: Equipment: 'heat pump' is not one we know");
  });

  it('remembers a hand mapping for the company\'s next file', async () => {
    const headers = ['Owner', 'Street', 'Town', 'Boiler', 'Fuel'];
    const first = await upload(as.manager, toCsv(headers, [['Lee Example', '4 Birch Rd', 'Wrenfield', 'Steam', 'Gas']]));
    expect(first.body.mapping.customerName).toBeUndefined();
    const mapping = { ...first.body.mapping, customerName: 'Owner', applianceKind: 'Boiler' };
    expect((await as.manager.post(`/api/imports/${first.body.id}/preview`).send({ mapping })).status).toBe(200);
    const next = await upload(as.manager, toCsv(headers, [['Kim Example', '9 Birch Rd', 'Wrenfield', 'Steam', 'Gas']]));
    expect(next.body.mapping).toMatchObject({ customerName: 'Owner', applianceKind: 'Boiler', siteStreet: 'Street' });
  });

  it('takes a site elevation column, guessed from "Altitude (ft)", with the site form\'s range', async () => {
    // Range as on the site form (sites.elevation_ft): −1,500 to 15,000 ft, the NFPA 54 derate rule's (shared/trade/gas-input.ts)
    const csv = toCsv(
      ['Customer', 'Address', 'City', 'Kind', 'Fuel', 'Altitude (ft)'],
      [
        ['Alex Example', '7 Pine Rd', 'Highfield', 'Steam', 'Gas', '5,280'],
        ['Bo Example', '8 Pine Rd', 'Highfield', 'Steam', 'Gas', '16000'],
        ['Cal Example', '9 Pine Rd', 'Highfield', 'Steam', 'Gas', ''],
      ],
    );
    const res = await upload(as.manager, csv, 'elevations.csv');
    expect(res.status).toBe(201);
    expect(res.body.mapping.siteElevationFt).toBe('Altitude (ft)');
    const preview = await as.manager.post(`/api/imports/${res.body.id}/preview`).send({ mapping: res.body.mapping });
    expect(preview.status).toBe(200);
    expect(preview.body.errors).toEqual([
      expect.objectContaining({ row: 3, column: 'Altitude (ft)', message: "'16000' is not a site elevation in feet (a whole number from −1,500 to 15,000, as on the site form)." }),
    ]);
    await as.manager.post(`/api/imports/${res.body.id}/run`).send({ mapping: res.body.mapping });
    await finished(res.body.id);
    const stored = await ctx.db.select({ street: sites.street, elevationFt: sites.elevationFt }).from(sites).where(and(eq(sites.companyId, t.company.id), eq(sites.town, 'Highfield')));
    expect(stored.sort((a, b) => a.street.localeCompare(b.street))).toEqual([
      { street: '7 Pine Rd', elevationFt: 5280 },
      { street: '9 Pine Rd', elevationFt: null },
    ]);
  });

  it('reads a Windows-1252 file without losing its accents', async () => {
    const bytes = Buffer.from('Customer,Address,City,Kind,Fuel\r\nRen\xe9e Ex\xe1mple,3 Birch Rd,Wrenfield,Water heater,Propane\r\n', 'latin1');
    const res = await upload(as.manager, bytes, 'old-system.csv');
    expect(res.body.encoding).toBe('windows-1252');
    await as.manager.post(`/api/imports/${res.body.id}/run`).send({ mapping: res.body.mapping });
    await finished(res.body.id);
    expect((await ctx.db.select().from(customers).where(and(eq(customers.companyId, t.company.id), eq(customers.name, 'Renée Exámple')))).length).toBe(1);
  });
});

describe('a large file', () => {
  it('runs in the background with progress, and a second run waits for it', async () => {
    const big = toCsv(SAMPLE_IMPORT_HEADERS, sampleImportRows(260, { seed: 12, today: '2026-11-18' }));
    const res = await upload(as.manager, big, 'big.csv');
    const run = await as.manager.post(`/api/imports/${res.body.id}/run`).send({ mapping: res.body.mapping });
    expect(run.status).toBe(202);
    expect(run.body).toMatchObject({ status: 'queued', rowsDone: 0, rowCount: 260 });
    const other = await upload(as.manager, 'Customer,Street,Town,Kind,Fuel\nCy Example,6 Ash Ln,Wrenfield,Furnace,Gas\n');
    const blocked = await as.manager.post(`/api/imports/${other.body.id}/run`).send({ mapping: other.body.mapping });
    // Unless the big one already finished on this machine, the second waits its turn.
    if (blocked.status === 409) expect(blocked.body.error.message).toBe('big.csv is being imported now. Wait for it to finish, then start this one.');
    else expect(blocked.status).toBe(200);
    const done = await finished(res.body.id);
    expect(done).toMatchObject({ status: 'done', rowsDone: 260, summary: { appliances: { create: 260 } } });
  });
});

describe('bad files and bad requests', () => {
  it.each([
    ['an empty file', '', 'The file is empty.'],
    ['a binary file named .csv', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0x08, 0x00]), 'This is not a text file'],
    ['a file without a header row', 'Pat Example,555-0142,12 Elm St,Wrenfield,Steam\nLee Example,555-0199,4 Oak Rd,Wrenfield,Gas\n', 'The first row reads like data'],
    ['a header and nothing else', 'Customer,City\n', 'no data rows'],
  ])('refuses %s with a field error and stores nothing', async (_what, body, message) => {
    const before = (await ctx.db.select({ n: count() }).from(importFiles).where(eq(importFiles.companyId, t.company.id)))[0].n;
    const res = await upload(as.manager, body as Buffer | string);
    expect(res.status).toBe(400);
    expect(res.body.error.details.file[0]).toContain(message);
    expect((await ctx.db.select({ n: count() }).from(importFiles).where(eq(importFiles.companyId, t.company.id)))[0].n).toBe(before);
  });

  it('refuses a file over 20 MB with 413', async () => {
    const big = Buffer.alloc(21 * 2 ** 20, 'a,b\n');
    const res = await upload(as.manager, big);
    expect(res.status).toBe(413);
    expect(res.body.error.details.file[0]).toContain('larger than 20 MB');
  });

  it('asks for a file when there is none', async () => {
    const res = await as.manager.post('/api/imports').field('note', 'x');
    expect(res.status).toBe(400);
    expect(res.body.error.details.file).toEqual(['Choose a CSV file to upload.']);
  });

  it('refuses a mapping to a column the file does not have, or a run without the required columns', async () => {
    const res = await upload(as.manager, 'Customer,Street,Town,Kind,Fuel\nA Example,1 Oak St,Wrenfield,Steam,Gas\n');
    const wrong = await as.manager.post(`/api/imports/${res.body.id}/preview`).send({ mapping: { customerName: 'Nope' } });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.details['mapping.customerName']).toEqual(["The file has no column 'Nope'."]);
    const unknown = await as.manager.post(`/api/imports/${res.body.id}/preview`).send({ mapping: { favouriteColour: 'Kind' } });
    expect(unknown.status).toBe(400);
    const missing = await as.manager.post(`/api/imports/${res.body.id}/run`).send({ mapping: { customerName: 'Customer' } });
    expect(missing.status).toBe(400);
    expect(missing.body.error.details['mapping.siteStreet']).toEqual(['Choose the column for Street address.']);
    const [row] = await ctx.db.select().from(importFiles).where(eq(importFiles.id, res.body.id));
    expect(row.status).toBe('uploaded');
  });

  it('is for the office: 401 signed out, 403 for a technician, 404 for another company', async () => {
    const res = await upload(as.manager, 'Customer,Street,Town,Kind,Fuel\nB Example,2 Oak St,Wrenfield,Steam,Gas\n');
    const id = res.body.id as string;
    expect((await upload(as.anonymous, 'Customer\nA\n')).status).toBe(401);
    expect((await upload(as.technician, 'Customer\nA\n')).status).toBe(403);
    expect((await as.technician.get(`/api/imports/${id}`)).status).toBe(403);
    expect((await as.owner.get(`/api/imports/${id}`)).status).toBe(200);
    for (const req of [
      otherAs.manager.get(`/api/imports/${id}`),
      otherAs.manager.post(`/api/imports/${id}/preview`).send({ mapping: res.body.mapping }),
      otherAs.manager.post(`/api/imports/${id}/run`).send({ mapping: res.body.mapping }),
      otherAs.manager.get(`/api/imports/${id}/errors.csv`),
    ]) {
      expect((await req).status).toBe(404);
    }
    expect((await otherAs.manager.get('/api/imports')).body.map((f: ImportFileDto) => f.id)).not.toContain(id);
  });
});

describe('the import job', () => {
  it('picks up an import whose run stopped reporting, leaves a live one alone, and deletes kept files past their time', async () => {
    const { importJob } = await import('../../server/jobs/import-job');
    const stale = await upload(as.manager, 'Customer,Street,Town,Kind,Fuel\nJo Example,8 Ash Ln,Wrenfield,Furnace,Gas\n', 'stopped.csv');
    const live = await upload(as.manager, 'Customer,Street,Town,Kind,Fuel\nMo Example,9 Ash Ln,Wrenfield,Furnace,Gas\n', 'running.csv');
    const tenMinutesAgo = new Date(Date.now() - 10 * 60_000);
    await ctx.db.update(importFiles).set({ status: 'importing', heartbeatAt: tenMinutesAgo, mapping: stale.body.mapping }).where(eq(importFiles.id, stale.body.id));
    await ctx.db.update(importFiles).set({ status: 'importing', heartbeatAt: new Date(), mapping: live.body.mapping }).where(eq(importFiles.id, live.body.id));
    const old = await upload(as.manager, 'Customer,Street,Town,Kind,Fuel\nAl Example,7 Ash Ln,Wrenfield,Furnace,Gas\n', 'old.csv');
    const [oldRow] = await ctx.db.update(importFiles).set({ createdAt: new Date(Date.now() - 91 * 86_400_000) }).where(eq(importFiles.id, old.body.id)).returning();

    const result = await importJob(ctx);
    expect(result.resumed).toBeGreaterThanOrEqual(1);
    expect((await as.manager.get(`/api/imports/${stale.body.id}`)).body.status).toBe('done');
    expect((await ctx.db.select().from(customers).where(and(eq(customers.companyId, t.company.id), eq(customers.name, 'Jo Example')))).length).toBe(1);
    expect((await as.manager.get(`/api/imports/${live.body.id}`)).body.status).toBe('importing');
    const [swept] = await ctx.db.select().from(importFiles).where(eq(importFiles.id, old.body.id));
    expect(swept.objectKey).toBeNull();
    await expect(ctx.storage.get(oldRow.objectKey!)).rejects.toThrow();
    const preview = await as.manager.post(`/api/imports/${old.body.id}/preview`).send({ mapping: old.body.mapping });
    expect(preview.status).toBe(410);
    expect(preview.body.error.message).toBe('The file old.csv was deleted after its keeping time. Upload it again.');
    // The photo sweep leaves the kept import files alone, however old: they are not photos.
    const { sweepOrphanObjects } = await import('../../server/modules/photos/sweep-orphan-objects');
    const [kept] = await ctx.db.select().from(importFiles).where(eq(importFiles.id, live.body.id));
    // Only under imports/, so no other test file's upload in flight is touched.
    const { deleted } = await sweepOrphanObjects(ctx, { olderThanHours: 0, now: new Date(Date.now() + 86_400_000), prefix: 'imports/' });
    expect(deleted).toEqual([]);
    expect((await ctx.storage.get(kept.objectKey!)).body.length).toBeGreaterThan(0);
    // Leave the company free for other imports.
    await ctx.db.update(importFiles).set({ status: 'failed' }).where(eq(importFiles.id, live.body.id));
  });
});

import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import QRCode from 'qrcode';
import sharp from 'sharp';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, PHONE, screenshotDir, startTestServer, signInAsMember } from '../support/browser';
import { createTenant, type Tenant } from '../support/tenant';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { tags } from '../../server/db/schema/index';
import { checkCharacter, formatTagCode } from '../../shared/tags/tag-code';

const WIDTH = 640;
const HEIGHT = 480;
const FRAMES = 30;
const STREET = '27 Larchmoor Way';

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let t: Tenant;
let other: Tenant;
let boilerId: string;
let heaterId: string;
let furnaceId: string;
let boilerCode: string;
let spareCode: string;
let newCode: string;
let replacementCode: string;
let workDir: string;
const shots = () => process.env.LIFEPLATE_KEEP_SCREENSHOTS ?? screenshotDir();

/**
 * A camera that films a printed tag: the QR of `url` centred on white, as a YUV4MPEG2 file Chromium's fake
 * capture device plays in a loop (4:2:0, so after the luma plane come two quarter-size chroma planes; 128 = no colour).
 */
async function fakeCameraFile(url: string): Promise<string> {
  const qr = await QRCode.toBuffer(url, { margin: 4, width: 360 });
  const luma = await sharp({ create: { width: WIDTH, height: HEIGHT, channels: 3, background: '#ffffff' } })
    .composite([{ input: qr, gravity: 'centre' }])
    .greyscale()
    .extractChannel(0)
    .raw()
    .toBuffer();
  expect(luma.length).toBe(WIDTH * HEIGHT);
  const chroma = Buffer.alloc((WIDTH / 2) * (HEIGHT / 2) * 2, 128);
  const frame = Buffer.concat([Buffer.from('FRAME\n'), luma, chroma]);
  const header = Buffer.from(`YUV4MPEG2 W${WIDTH} H${HEIGHT} F30:1 Ip A1:1 C420jpeg\n`);
  const file = path.join(workDir, 'tag-camera.y4m');
  fs.writeFileSync(file, Buffer.concat([header, ...Array.from({ length: FRAMES }, () => frame)]));
  return file;
}

async function makeTags(email: string, count: number): Promise<string[]> {
  const agent = request.agent(server.baseUrl);
  expect((await agent.post('/api/auth/sign-in/email').send({ email, password: DEFAULT_TEST_PASSWORD })).status).toBe(200);
  const batch = await agent.post('/api/tag-batches').send({ count, format: 'sheet_1x2_625' });
  expect(batch.status).toBe(201);
  return batch.body.codes;
}

async function assignAsManager(code: string, applianceId: string) {
  const agent = request.agent(server.baseUrl);
  await agent.post('/api/auth/sign-in/email').send({ email: t.manager.user.email, password: DEFAULT_TEST_PASSWORD });
  expect((await agent.post('/api/tags/assign').send({ code, applianceId })).status).toBe(200);
}

async function phonePage(): Promise<{ page: Page; errors: string[] }> {
  const context = await browser.newContext(PHONE);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
  page.on('console', (m) => {
    // A 404 from resolve is an expected answer; Chromium logs it as a failed resource.
    if (m.type() === 'error' && !m.text().startsWith('Failed to load resource')) errors.push(`console: ${m.text()}`);
  });
  return { page, errors };
}

async function signIn(page: Page, email: string) {
  await signInAsMember(page, server.baseUrl, email);
}

beforeAll(async () => {
  server = await startTestServer();
  workDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tag-scan-'));
  [t, other] = await Promise.all([createTenant(server.ctx.db), createTenant(server.ctx.db)]);
  const site = await insertSite(server.ctx.db, { companyId: t.company.id, customerId: t.customer.id, street: STREET, town: 'Wrenfield' });
  boilerId = (await insertAppliance(server.ctx.db, { companyId: t.company.id, siteId: site.id })).id;
  heaterId = (await insertAppliance(server.ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'water_heater' })).id;
  furnaceId = (await insertAppliance(server.ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'furnace', serial: 'FQ55TAGTEST' })).id;
  [boilerCode, spareCode, newCode, replacementCode] = await makeTags(t.manager.user.email, 4);
  await assignAsManager(boilerCode, boilerId);
  await makeTags(other.manager.user.email, 1);
  const camera = await fakeCameraFile(`${server.baseUrl}/t/${boilerCode}`);
  browser = await launchBrowser(['--use-fake-ui-for-media-stream', '--use-fake-device-for-media-stream', `--use-file-for-fake-video-capture=${camera}`]);
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
  if (workDir) fs.rmSync(workDir, { recursive: true, force: true });
});

describe('scanning a tag', () => {
  it("a technician's camera reads the tag and the appliance record opens", async () => {
    const { page, errors } = await phonePage();
    await signIn(page, t.technician.user.email);
    await page.goto(`${server.baseUrl}/scan`);
    await page.waitForURL(`${server.baseUrl}/appliances/${boilerId}`);
    const tagSection = page.getByRole('region', { name: 'Tag' });
    await tagSection.getByText(formatTagCode(boilerCode)).waitFor();
    await page.getByRole('button', { name: 'Start visit' }).waitFor();
    await page.screenshot({ path: path.join(shots(), 'tag-scan-record.png') });
    // The scan hop replaced itself: Back returns to the scanner, not to the tag page.
    await page.goBack();
    await page.waitForURL(`${server.baseUrl}/scan`);
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('attaches a typed code from the record, refusing a mistyped one with the reason', async () => {
    const { page, errors } = await phonePage();
    await signIn(page, t.technician.user.email);
    await page.goto(`${server.baseUrl}/appliances/${heaterId}`);
    const section = page.getByRole('region', { name: 'Tag' });
    await section.getByText('No tag yet').waitFor();
    await section.getByRole('button', { name: 'Attach a tag' }).click();
    const field = section.getByRole('textbox', { name: 'Tag code' });

    const wrongCheck = [...'23456789'].find((ch) => ch !== spareCode.at(-1))!;
    await field.fill(`${spareCode.slice(0, 7)}${wrongCheck}`);
    await section.getByText('This code does not check out: a character is mistyped.').waitFor();
    await field.fill(`${spareCode.slice(0, 7)}0`);
    await section.getByText("'0' never appears in a tag code (did you mean 9 or D?).").waitFor();
    await page.screenshot({ path: path.join(shots(), 'tag-typed-error.png') });

    await field.fill(formatTagCode(spareCode).toLowerCase());
    await section.getByRole('button', { name: 'Attach this tag' }).click();
    await section.getByText(formatTagCode(spareCode)).waitFor();
    await section.getByRole('button', { name: 'Replace a damaged tag' }).waitFor();
    const [row] = await server.ctx.db.select().from(tags).where(eq(tags.code, spareCode));
    expect(row).toMatchObject({ status: 'assigned', applianceId: heaterId, assignedBy: t.technician.user.id });
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

describe('without a camera', () => {
  it('says the camera is not available, refuses a photo of a QR that is not a tag, and a typed code still opens the record', async () => {
    const cameraless = await launchBrowser();
    try {
      const context = await cameraless.newContext(PHONE);
      const page = await context.newPage();
      const errors: string[] = [];
      page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
      await signIn(page, t.technician.user.email);
      await page.goto(`${server.baseUrl}/scan`);
      const notice = page.getByRole('note').filter({ hasText: 'Camera not available' });
      await notice.waitFor();
      expect(await notice.innerText()).toMatch(/refused|No camera was found/);
      await page.getByRole('button', { name: 'Start the camera' }).waitFor();
      await page.screenshot({ path: path.join(shots(), 'tag-no-camera.png'), fullPage: true });

      const menuPhoto = path.join(workDir, 'menu-qr.png');
      fs.writeFileSync(menuPhoto, await QRCode.toBuffer('https://example.test/menu', { margin: 4, width: 300 }));
      await page.locator('input[type=file]').setInputFiles(menuPhoto);
      await page.getByText('This QR code is not a Lifeplate tag').waitFor();
      await page.getByText('https://example.test/menu', { exact: false }).waitFor();

      await page.getByRole('textbox', { name: 'Tag code' }).fill(formatTagCode(boilerCode));
      await page.getByRole('button', { name: 'Open this tag' }).click();
      await page.waitForURL(`${server.baseUrl}/appliances/${boilerId}`);
      expect(errors).toEqual([]);
    } finally {
      await cameraless.close();
    }
  });
});

describe('a new tag, later damaged', () => {
  it('is attached from its own page by searching the appliance, then replaced; the old code still opens the record', async () => {
    const { page, errors } = await phonePage();
    await signIn(page, t.technician.user.email);
    await page.goto(`${server.baseUrl}/t/${newCode}`);
    await page.getByRole('heading', { name: 'Assign this tag' }).waitFor();
    await page.getByRole('searchbox', { name: 'Find the appliance' }).fill('FQ55TAG');
    await page.getByRole('list', { name: 'Appliances found' }).getByRole('button', { name: /FQ55TAGTEST/ }).click();
    await page.screenshot({ path: path.join(shots(), 'tag-assign-found.png') });
    await page.getByRole('button', { name: 'Attach the tag' }).click();
    await page.waitForURL(`${server.baseUrl}/appliances/${furnaceId}`);
    const section = page.getByRole('region', { name: 'Tag' });
    await section.getByText(formatTagCode(newCode)).waitFor();

    await section.getByRole('button', { name: 'Replace a damaged tag' }).click();
    await section.getByText(`Replace tag ${formatTagCode(newCode)}?`).waitFor();
    await section.getByText(/still opens this appliance/).waitFor();
    await page.screenshot({ path: path.join(shots(), 'tag-replace-confirm.png') });
    await section.getByRole('textbox', { name: 'New tag code' }).fill(replacementCode);
    await section.getByRole('button', { name: 'Replace the tag' }).click();
    await section.getByText(formatTagCode(replacementCode)).waitFor();
    await section.getByText(new RegExp(`Earlier tag, still opening this record: ${formatTagCode(newCode)}`)).waitFor();
    const stored = await server.ctx.db.select().from(tags).where(eq(tags.applianceId, furnaceId));
    expect(Object.fromEntries(stored.map((row) => [row.code, row.status]))).toEqual({ [newCode]: 'retired', [replacementCode]: 'assigned' });

    await page.goto(`${server.baseUrl}/t/${newCode}`);
    await page.getByText('This tag was replaced').waitFor();
    await page.screenshot({ path: path.join(shots(), 'tag-retired.png') });
    await page.getByRole('button', { name: 'Open the appliance record' }).click();
    await page.waitForURL(`${server.baseUrl}/appliances/${furnaceId}`);
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

describe('the office', () => {
  it('makes a batch of tags and gets its PDF', async () => {
    const { page, errors } = await phonePage();
    await signIn(page, t.manager.user.email);
    await page.goto(`${server.baseUrl}/tags`);
    const count = page.getByRole('textbox', { name: 'How many tags' });
    await count.fill('301');
    await page.getByRole('button', { name: 'Make tags' }).click();
    await page.getByText('At most 300 tags in one batch.').waitFor();
    await count.fill('2');
    await page.getByRole('radio', { name: 'Single large tag, 4 × 2½ in' }).check();
    await page.getByRole('button', { name: 'Make tags' }).click();
    await page.getByText('Made 2 new tags').waitFor();
    const row = page.getByRole('list', { name: 'Tag batches' }).getByRole('listitem').filter({ hasText: '2 tags · Single large tag, 4 × 2½ in' });
    await row.waitFor();
    const href = await row.getByRole('link', { name: 'Download PDF' }).getAttribute('href');
    const pdf = await page.request.get(`${server.baseUrl}${href}`);
    expect(pdf.status()).toBe(200);
    expect(pdf.headers()['content-type']).toBe('application/pdf');
    expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
    await page.getByText('Paper labels do not last on a boiler jacket.', { exact: false }).waitFor();
    await page.screenshot({ path: path.join(shots(), 'tag-batches.png'), fullPage: true });
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

describe('who else may open a tag', () => {
  it('a stranger sees whose tag it is and how to call them, nothing about the home', async () => {
    const { page, errors } = await phonePage();
    await page.goto(`${server.baseUrl}/t/${boilerCode}`);
    await page.getByText(/life record is kept by/).waitFor();
    const text = await page.locator('body').innerText();
    expect(text).toContain(t.company.name);
    expect(text).not.toContain(t.customer.name);
    expect(text).not.toContain(STREET);
    expect(text).not.toContain('Wrenfield');
    expect(await page.getByRole('link', { name: `Call ${t.company.phone}` }).getAttribute('href')).toBe(`tel:${t.company.phone.replace(/\D/g, '')}`);
    expect(await page.getByRole('link', { name: 'Sign in' }).getAttribute('href')).toBe(`/sign-in?next=${encodeURIComponent(`/t/${boilerCode}`)}`);
    await page.screenshot({ path: path.join(shots(), 'tag-public.png') });
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('a member of another company is told the tag belongs to another company, from the link and from the scanner', async () => {
    const { page, errors } = await phonePage();
    await signIn(page, other.technician.user.email);
    await page.goto(`${server.baseUrl}/t/${boilerCode}`);
    await page.getByText('This tag belongs to another company').waitFor();
    const text = await page.locator('body').innerText();
    expect(text).toContain(t.company.name);
    expect(text).not.toContain(t.customer.name);
    expect(text).not.toContain(STREET);

    await page.goto(`${server.baseUrl}/scan`);
    await page.getByText('This tag belongs to another company').waitFor();
    expect(page.url()).toBe(`${server.baseUrl}/scan`);
    await page.screenshot({ path: path.join(shots(), 'tag-scan-other-company.png') });
    expect(errors).toEqual([]);
    await page.context().close();
  });

  it('an unknown but well-formed code is plainly unknown', async () => {
    const { page, errors } = await phonePage();
    const body = 'WWWWWWW';
    await page.goto(`${server.baseUrl}/t/${body}${checkCharacter(body)}`);
    await page.getByRole('heading', { name: "We don't know this tag" }).waitFor();
    expect(errors).toEqual([]);
    await page.context().close();
  });
});

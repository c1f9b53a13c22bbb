import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import type { Locator, Page } from 'playwright-core';
import sharp from 'sharp';
import { PHONE, screenshotDir, signInAsMember, useBrowserFixture } from '../support/browser';
import { phoneJpegWithGps } from '../support/images';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { photos } from '../../server/db/schema/index';

const fx = useBrowserFixture();

// The run folder is removed after the run; set LIFEPLATE_KEEP_SCREENSHOTS to a folder to look at them afterwards.
async function screenshot(what: Page | Locator, name: string) {
  const dir = process.env.LIFEPLATE_KEEP_SCREENSHOTS ?? screenshotDir();
  fs.mkdirSync(dir, { recursive: true });
  await what.screenshot({ path: path.join(dir, `${name}.png`) });
}

const solidJpeg = (r: number, g: number, b: number) => sharp({ create: { width: 400, height: 300, channels: 3, background: { r, g, b } } }).jpeg().toBuffer();
const jpeg = (name: string, buffer: Buffer) => ({ name, mimeType: 'image/jpeg', buffer });
const rowsFor = (applianceId: string) => fx.server.ctx.db.select().from(photos).where(eq(photos.applianceId, applianceId));

/** Resolves with the image's decoded width once it has loaded (0 if it failed), without a fixed wait. */
const loadedWidth = (img: Locator) =>
  img.evaluate(
    (el: HTMLImageElement) =>
      new Promise<number>((resolve) => {
        if (el.complete) return resolve(el.naturalWidth);
        el.addEventListener('load', () => resolve(el.naturalWidth), { once: true });
        el.addEventListener('error', () => resolve(0), { once: true });
      }),
  );

async function signInOnPhone() {
  const context = await fx.browser.newContext(PHONE);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
  page.on('console', (m) => {
    // Chromium logs every refused request as a failed resource; the app's own handling of it is asserted instead.
    if (m.type() === 'error' && !m.text().startsWith('Failed to load resource')) errors.push(`console: ${m.text()}`);
  });
  await signInAsMember(page, fx.server.baseUrl, fx.t.technician.user.email);
  return { context, page, errors };
}

describe('photos on the life record, on a phone', () => {
  it('uploads a batch, opens one, shows it to the homeowner, dedupes a repeat, names a refused file, retries after a lost signal and after a stop', async () => {
    const site = await insertSite(fx.server.ctx.db, { companyId: fx.t.company.id, customerId: fx.t.customer.id, street: '6 Tallowmere Court', town: 'Wrenfield' });
    const boiler = await insertAppliance(fx.server.ctx.db, { companyId: fx.t.company.id, siteId: site.id });
    const [first, second] = await Promise.all([phoneJpegWithGps(640, 480), phoneJpegWithGps(480, 360)]);
    const { context, page, errors } = await signInOnPhone();

    await page.goto(`${fx.server.baseUrl}/appliances/${boiler.id}`);
    const section = page.getByRole('region', { name: 'Photos' });
    // Folded on the record, below its first screen; the summary says there are none.
    await section.getByText('none yet').waitFor();
    await section.locator('summary').click();
    await section.getByText('No photos yet.').waitFor();
    await section.getByText('Location data is removed from photos before they are stored.').waitFor();
    // No nameplate photo yet, so that is what the next one is taken to be.
    expect(await section.getByRole('radio', { name: 'Nameplate' }).isChecked()).toBe(true);
    await screenshot(section, 'c4-photos-empty');

    const takePhoto = section.getByLabel('Take photo');
    expect([await takePhoto.getAttribute('accept'), await takePhoto.getAttribute('capture')]).toEqual(['image/*', 'environment']);
    expect(await section.getByLabel('Choose files').getAttribute('multiple')).not.toBeNull();
    // Sent with XMLHttpRequest, the only browser API that reports upload progress.
    const uploadTypes: string[] = [];
    page.on('request', (r) => {
      if (r.method() === 'POST' && new URL(r.url()).pathname === '/api/photos') uploadTypes.push(r.resourceType());
    });

    await section.getByLabel('Caption (optional)').fill('Rating plate, burner side');
    await section.getByLabel('Choose files').setInputFiles([jpeg('plate-left.jpg', first), jpeg('plate-right.jpg', second)]);
    await section.getByRole('status').filter({ hasText: '2 photos saved.' }).waitFor();
    expect(await section.getByRole('progressbar', { name: 'Upload progress' }).getAttribute('aria-valuenow')).toBe('100');

    const thumbs = section.getByRole('list', { name: 'Photos' }).getByRole('img');
    await thumbs.nth(1).waitFor();
    expect(await thumbs.count()).toBe(2);
    for (const img of await thumbs.all()) {
      expect(await img.getAttribute('loading')).toBe('lazy');
      expect(await img.getAttribute('alt')).toBe('Rating plate, burner side');
      expect(await loadedWidth(img)).toBeGreaterThan(0);
    }
    expect(uploadTypes).toEqual(['xhr']);
    let rows = await rowsFor(boiler.id);
    expect(rows).toHaveLength(2);
    for (const row of rows) expect(row).toMatchObject({ companyId: fx.t.company.id, kind: 'nameplate', caption: 'Rating plate, burner side', homeownerVisible: false, visitId: null });
    // With a nameplate on file the next photo is a finding, and the caption was cleared for it.
    expect(await section.getByRole('radio', { name: 'Finding' }).isChecked()).toBe(true);
    expect(await section.getByLabel('Caption (optional)').inputValue()).toBe('');
    await screenshot(section, 'c4-photos-grid');

    // Open one: the display image loads in the viewer, with its kind and caption.
    await section.getByRole('button', { name: 'Open photo: Rating plate, burner side' }).first().click();
    const viewer = page.getByRole('dialog', { name: 'Nameplate photo' });
    const display = viewer.getByRole('img', { name: 'Rating plate, burner side' });
    await display.waitFor();
    expect(await loadedWidth(display)).toBeGreaterThan(0);
    await viewer.getByText('Rating plate, burner side').waitFor();
    await viewer.getByText(/^Added /).waitFor();
    const openedId = (await display.getAttribute('src'))!.match(/\/api\/photos\/([0-9a-f-]{36})\/display$/)![1];
    await screenshot(page, 'c4-photos-viewer');

    const visible = viewer.getByRole('switch', { name: 'Visible to the homeowner' });
    expect(await visible.isChecked()).toBe(false);
    await visible.click();
    await viewer.getByText('The homeowner sees this photo on their record.').waitFor();
    rows = await rowsFor(boiler.id);
    expect(rows.find((r) => r.id === openedId)?.homeownerVisible).toBe(true);
    expect(rows.find((r) => r.id !== openedId)?.homeownerVisible).toBe(false);
    await viewer.getByRole('button', { name: 'Close' }).click();
    await viewer.waitFor({ state: 'hidden' });
    await section.getByRole('list', { name: 'Photos' }).getByText('Homeowner can see this photo').waitFor();
    expect(await section.getByText('Homeowner can see this photo').count()).toBe(1);

    // The same file again is not stored twice.
    await section.getByLabel('Choose files').setInputFiles([jpeg('plate-left.jpg', first)]);
    await section.getByText('Already saved: this photo was on the record already.').waitFor();
    expect(await rowsFor(boiler.id)).toHaveLength(2);

    // A text file dressed as a JPEG: the server's reason, under the file's name, and nothing stored.
    const notAPhoto = Buffer.from('Gas meter read 0412 on arrival.');
    await section.getByLabel('Choose files').setInputFiles([jpeg('meter-notes.jpg', notAPhoto)]);
    const refused = section.getByRole('list', { name: 'Files not taken' }).getByRole('listitem');
    await refused.filter({ hasText: 'meter-notes.jpg' }).getByText('This file is not an image we can read. Send a JPEG, PNG or WebP photo.').waitFor();
    await section.getByRole('alert').filter({ hasText: 'Not saved' }).waitFor();
    expect(await section.getByRole('button', { name: /^Send the other|^Try again$/ }).count()).toBe(0);
    const textSha = crypto.createHash('sha256').update(notAPhoto).digest('hex');
    rows = await rowsFor(boiler.id);
    expect(rows).toHaveLength(2);
    expect(rows.some((r) => r.sha256 === textSha)).toBe(false);
    await screenshot(section, 'c4-photos-refused');

    // The same bad file in a batch with a good one: the batch is refused whole, then the good one goes on its own.
    const soot = await solidJpeg(40, 40, 40);
    await section.getByLabel('Caption (optional)').fill('Soot on the flue collar');
    await section.getByLabel('Choose files').setInputFiles([jpeg('meter-notes.jpg', notAPhoto), jpeg('flue-collar.jpg', soot)]);
    await section.getByText('None of the 2 files were saved, because one was refused.').waitFor();
    await section.getByRole('button', { name: 'Send the other 1 photo' }).click();
    await section.getByRole('status').filter({ hasText: '1 photo saved.' }).waitFor();
    rows = await rowsFor(boiler.id);
    expect(rows).toHaveLength(3);
    expect(rows.find((r) => r.caption === 'Soot on the flue collar')).toMatchObject({ kind: 'finding', sha256: crypto.createHash('sha256').update(soot).digest('hex') });

    // Signal lost mid-upload: the files are kept and "Try again" sends the same ones.
    const isUpload = (url: URL) => url.pathname === '/api/photos';
    await page.route(isUpload, (route) => (route.request().method() === 'POST' ? route.abort('internetdisconnected') : route.continue()));
    const scorch = await solidJpeg(150, 60, 20);
    await section.getByLabel('Choose files').setInputFiles([jpeg('scorch.jpg', scorch)]);
    await section.getByRole('alert').filter({ hasText: 'No connection' }).waitFor();
    expect(await rowsFor(boiler.id)).toHaveLength(3);
    await page.unroute(isUpload);
    await section.getByRole('button', { name: 'Try again' }).click();
    await section.getByRole('status').filter({ hasText: '1 photo saved.' }).waitFor();
    rows = await rowsFor(boiler.id);
    expect(rows).toHaveLength(4);
    expect(rows.filter((r) => r.sha256 === crypto.createHash('sha256').update(scorch).digest('hex'))).toHaveLength(1);

    // A send that hangs (a basement with one bar) can be stopped; the files stay and go with "Try again".
    await page.route(isUpload, (route) => (route.request().method() === 'POST' ? undefined : route.continue()));
    const valve = await solidJpeg(20, 90, 160);
    await section.getByLabel('Take photo').setInputFiles([jpeg('image.jpg', valve)]);
    await section.getByRole('button', { name: 'Stop sending' }).click();
    await section.getByRole('alert').filter({ hasText: 'Sending was stopped.' }).waitFor();
    await page.unrouteAll({ behavior: 'ignoreErrors' });
    await section.getByRole('button', { name: 'Try again' }).click();
    await section.getByRole('status').filter({ hasText: '1 photo saved.' }).waitFor();
    rows = await rowsFor(boiler.id);
    expect(rows).toHaveLength(5);
    expect(rows.filter((r) => r.sha256 === crypto.createHash('sha256').update(valve).digest('hex'))).toHaveLength(1);

    // Filter chips narrow the grid by kind.
    await section.getByRole('list', { name: 'Photos' }).getByRole('img').nth(4).waitFor();
    await section.getByRole('button', { name: 'Nameplate (2)' }).click();
    expect(await section.getByRole('list', { name: 'Photos' }).getByRole('img').count()).toBe(2);
    await section.getByRole('button', { name: 'Finding (3)' }).click();
    expect(await section.getByRole('list', { name: 'Photos' }).getByRole('img').count()).toBe(3);
    await section.getByRole('button', { name: 'Open photo: Soot on the flue collar' }).waitFor();
    await section.getByRole('button', { name: 'Before (0)' }).click();
    await section.getByText('No photos of this kind.').waitFor();

    await section.getByRole('button', { name: 'All (5)' }).click();
    await page.evaluate(() => document.documentElement.classList.add('dim'));
    await screenshot(section, 'c4-photos-dim');

    expect(errors).toEqual([]);
    await context.close();
  });
});

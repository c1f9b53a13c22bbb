import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import type { BrowserContext, Page } from 'playwright-core';
import { PHONE, screenshotDir, signInAsMember, useBrowserFixture } from '../support/browser';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { insertBooking } from '../../server/db/factories/bookings';
import { insertMember } from '../../server/db/factories/users';
import { idempotencyKeys, partSwaps, photos, visits } from '../../server/db/schema/index';
import { phoneJpegWithGps } from '../support/images';
import { todayInTimeZone } from '../../shared/dates';

/*
 * The technician's phone with no signal at all: the installed shell (service worker), the round and its records
 * saved in the signed-in person's IndexedDB, a visit started, swapped and finished offline and sent exactly once.
 * Chromium's own offline switch (context.setOffline) cuts every request, the service worker's included.
 */

const fx = useBrowserFixture();
const OFFLINE_PHONE = { ...PHONE, serviceWorkers: 'allow' as const };

/** A technician of their own (a round may not overlap itself) with a steam boiler booked today, at an invented street. */
async function bookedSteamBoiler(street: string) {
  const db = fx.server.ctx.db;
  const companyId = fx.t.company.id;
  const technician = await insertMember(db, { companyId, role: 'technician' });
  const technicianId = technician.user.id;
  const site = await insertSite(db, { companyId, customerId: fx.t.customer.id, street, town: 'Wrenfield' });
  const boiler = await insertAppliance(db, {
    companyId,
    siteId: site.id,
    kind: 'steam_boiler',
    fuel: 'natural_gas',
    construction: 'cast_iron',
    installedOn: '2004-10-12',
    components: [
      { typeCode: 'thermocouple', spec: { lengthIn: 24 }, installedOn: '2019-11-02' },
      { typeCode: 'low_water_cutoff_float' },
      { typeCode: 'gauge_glass', spec: { lengthIn: 12, diameterIn: 0.625 } },
    ],
  });
  const today = todayInTimeZone(fx.t.company.timeZone);
  await insertBooking(db, { companyId, siteId: site.id, technicianId, applianceIds: [boiler.id], start: `${today}T00:00`, end: `${today}T23:59`, timeZone: fx.t.company.timeZone });
  return { boiler, email: technician.user.email, technicianId };
}

/** Signs in, opens the round with signal and waits until the phone holds it: the shell installed, the record saved. */
async function roundSavedOnPhone(email: string): Promise<{ context: BrowserContext; page: Page }> {
  const context = await fx.browser.newContext(OFFLINE_PHONE);
  const page = await context.newPage();
  await signInAsMember(page, fx.server.baseUrl, email);
  await page.goto(`${fx.server.baseUrl}/round`);
  await page.getByText('Saved for offline: 1 record').waitFor();
  // The service worker controls the page once it has precached the shell (it claims the page on its first install).
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 30_000 });
  await expect.poll(() => savedQueryKeys(page), { timeout: 10_000 }).toContainEqual(expect.stringMatching(/^\["appliance","[0-9a-f-]{36}"\]$/));
  return { context, page };
}

/** The query keys in this person's saved store, read straight from IndexedDB. */
function savedQueryKeys(page: Page): Promise<string[]> {
  return page.evaluate(async () => {
    const userId = localStorage.getItem('lifeplate:offline-user');
    if (!userId) return [];
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const req = indexedDB.open(`lifeplate-cache-${userId}`);
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error);
    });
    if (!db.objectStoreNames.contains('queries')) return [];
    const saved = await new Promise<{ clientState?: { queries: { queryKey: unknown[] }[] } } | undefined>((resolve, reject) => {
      const req = db.transaction('queries').objectStore('queries').get('query-cache');
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error);
    });
    db.close();
    return (saved?.clientState?.queries ?? []).map((q) => JSON.stringify(q.queryKey));
  });
}

/** Everything a steam tune-up needs before it can be completed, typed on the phone. */
async function fillTuneUp(page: Page) {
  const items = page.locator('li[data-item]');
  await items.first().waitFor();
  const count = await items.count();
  for (let i = 0; i < count; i++) await items.nth(i).getByRole('button', { name: 'Done', exact: true }).click();
  const lwco = page.locator('li[data-item="lwco_test"]');
  await lwco.getByRole('button', { name: 'Float' }).click();
  await lwco.getByRole('textbox', { name: 'Level in the glass when it tripped' }).fill('1/4');
  await lwco.getByRole('button', { name: /Still visible in the glass/ }).click();
  await lwco.getByRole('button', { name: /Yes, it stopped/ }).click();
  await page.locator('li[data-item="water_level"]').getByRole('textbox', { name: 'Water level in the gauge glass' }).fill('5/8');
  const combustion = page.locator('li[data-item="combustion_test"]');
  await combustion.getByRole('textbox', { name: /^O2/ }).fill('7.5');
  await combustion.getByRole('textbox', { name: /^CO/ }).fill('40');
  await combustion.getByRole('textbox', { name: /^Flue temp/ }).fill('420');
  await combustion.getByRole('textbox', { name: /^Air temp/ }).fill('68');
  await page.getByRole('textbox', { name: 'Findings' }).fill('Cutoff tripped and stopped the burner. Thermocouple replaced with no signal.');
  await page.getByRole('button', { name: 'Left operating', exact: true }).click();
  return count;
}

async function swapThermocouple(page: Page) {
  await page.getByRole('button', { name: /^thermocouple/ }).click();
  const sheet = page.getByRole('dialog');
  await sheet.getByRole('radio', { name: 'Worn out or failed' }).check();
  await sheet.getByRole('group', { name: 'Quick reasons' }).getByRole('button', { name: 'pilot drops out' }).click();
  await sheet.getByRole('button', { name: 'Replaced today' }).click();
  await page.getByRole('list', { name: 'Swapped on this phone, waiting to send' }).getByText(/thermocouple replaced · pilot drops out · waiting for signal/).waitFor();
}

const visitsOf = (applianceId: string) => fx.server.ctx.db.select().from(visits).where(eq(visits.applianceId, applianceId));

describe('the technician’s phone with no signal', () => {
  it('reloads into the saved round, starts, swaps and finishes a visit offline, and sends it once when signal returns', async () => {
    const { boiler, email, technicianId } = await bookedSteamBoiler('9 Quillon Steps');
    const { context, page } = await roundSavedOnPhone(email);

    await context.setOffline(true);
    await page.reload();
    await page.getByText(/^No signal: showing what was saved at \d{1,2}:\d{2}\s?[AP]M\.$/).waitFor();
    await page.screenshot({ path: `${screenshotDir()}/offline-round-360.png` });

    await page.getByRole('link', { name: /Steam boiler/ }).first().click();
    await page.waitForURL(`**/appliances/${boiler.id}`);
    await page.getByRole('region', { name: 'What it is' }).getByText(boiler.serial!).waitFor();
    await page.getByRole('button', { name: 'Start the booked visit' }).click();
    await page.waitForURL(/\/visits\/[0-9a-f-]{36}$/);
    const visitId = page.url().split('/').pop()!;

    const count = await fillTuneUp(page);
    await swapThermocouple(page);
    await page.getByText('Saved on this phone — will send when signal returns').waitFor();
    // A photo with no signal: kept on the phone as a file, sent in its turn.
    const photoSection = page.getByRole('region', { name: 'Photos' });
    const fold = photoSection.locator('summary');
    if (await fold.count()) await fold.first().click();
    await photoSection.getByLabel('Choose files').setInputFiles([{ name: 'flue-collar.jpg', mimeType: 'image/jpeg', buffer: await phoneJpegWithGps() }]);
    await photoSection.getByText('No signal: 1 photo kept on this phone, sent by itself when signal returns.').waitFor();
    await page.getByRole('button', { name: 'Complete visit' }).click();
    await page.getByRole('note').filter({ hasText: 'Finished on this phone' }).waitFor();
    await page.screenshot({ path: `${screenshotDir()}/offline-finished-360.png` });

    // A reload with no signal (a closed tab, a phone restart) keeps all of it, in order.
    await page.reload();
    await page.getByRole('note').filter({ hasText: 'Finished on this phone' }).waitFor();
    await page.getByText('4 changes waiting to send.').waitFor();
    await page.getByRole('link', { name: 'See what is waiting' }).click();
    const waiting = page.getByRole('list').filter({ hasText: 'Start the visit' });
    const labels = await waiting.locator('h2, h3').allTextContents();
    expect(labels.map((l) => l.split(' · ')[0])).toEqual(['Start the visit', 'thermocouple replaced', '1 photo', 'Finish the visit']);
    expect(await visitsOf(boiler.id)).toEqual([]);

    await context.setOffline(false);
    await page.getByText('Nothing is waiting: the office has everything recorded on this phone.').waitFor({ timeout: 30_000 });

    const stored = await visitsOf(boiler.id);
    expect(stored.map((v) => [v.id, v.status, v.outcome])).toEqual([[visitId, 'completed', 'left_operating']]);
    expect(stored[0].checklist).toHaveLength(count);
    expect(stored[0].checklist.every((c) => c.mark === 'done')).toBe(true);
    expect(stored[0].readings).toMatchObject({ gaugeGlassLevel: '5/8', combustion: { o2Pct: 7.5, coPpm: 40, flueTempF: 420, airTempF: 68 } });
    expect(stored[0].bookingId).not.toBeNull();
    const swaps = await fx.server.ctx.db.select().from(partSwaps).where(eq(partSwaps.applianceId, boiler.id));
    expect(swaps.map((s) => [s.visitId, s.cause, s.reason])).toEqual([[visitId, 'wear_or_failure', 'pilot drops out']]);
    const storedPhotos = await fx.server.ctx.db.select().from(photos).where(eq(photos.visitId, visitId));
    expect(storedPhotos).toHaveLength(1);
    // Each replayed JSON write carried its own key, kept by the server with the answer it gave (a photo needs none: the
    // server stores a file once per record, by its SHA-256).
    const keys = await fx.server.ctx.db.select().from(idempotencyKeys).where(eq(idempotencyKeys.userId, technicianId));
    expect(keys.filter((k) => k.path.includes(visitId) || k.path.endsWith('/visits')).length).toBeGreaterThanOrEqual(3);

    await page.goto(`${fx.server.baseUrl}/visits/${visitId}`);
    await page.getByRole('heading', { name: /Annual maintenance/i }).waitFor();
    expect(await page.getByText('Finished on this phone').count()).toBe(0);
    await context.close();
  });

  it('sends a queued visit exactly once while the signal comes and goes', async () => {
    const { boiler, email } = await bookedSteamBoiler('2 Fennick Wynd');
    const { context, page } = await roundSavedOnPhone(email);
    await context.setOffline(true);
    await page.getByRole('link', { name: /Steam boiler/ }).first().click();
    await page.getByRole('button', { name: 'Start the booked visit' }).click();
    await page.waitForURL(/\/visits\/[0-9a-f-]{36}$/);
    const visitId = page.url().split('/').pop()!;
    await fillTuneUp(page);
    await swapThermocouple(page);
    await page.getByRole('button', { name: 'Complete visit' }).click();
    await page.getByRole('note').filter({ hasText: 'Finished on this phone' }).waitFor();

    // One bar, then none, over and over: every write may be cut off mid-way, its answer lost.
    for (let i = 0; i < 6; i++) {
      await context.setOffline(false);
      await page.evaluate((ms) => new Promise((resolve) => setTimeout(resolve, ms)), 40 + i * 30);
      await context.setOffline(true);
    }
    await context.setOffline(false);
    await expect.poll(async () => (await visitsOf(boiler.id)).map((v) => v.status), { timeout: 60_000 }).toEqual(['completed']);
    await page.getByRole('link', { name: 'See what is waiting' }).waitFor({ state: 'detached', timeout: 30_000 });

    const stored = await visitsOf(boiler.id);
    expect(stored.map((v) => v.id)).toEqual([visitId]);
    const swaps = await fx.server.ctx.db.select().from(partSwaps).where(eq(partSwaps.applianceId, boiler.id));
    expect(swaps).toHaveLength(1);
    await context.close();
  });

  it('after sign-out the next technician on the phone reads none of the first one’s saved records', async () => {
    const { boiler, email } = await bookedSteamBoiler('41 Marlock Hythe');
    const { context, page } = await roundSavedOnPhone(email);
    const firstUser = await page.evaluate(() => localStorage.getItem('lifeplate:offline-user'));

    expect(await savedQueryKeys(page)).toContainEqual(`["appliance","${boiler.id}"]`);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL('**/sign-in');

    expect(await savedQueryKeys(page)).toEqual([]);
    const left = await page.evaluate((id) => {
      const drafts = Object.keys(localStorage).filter((k) => k.startsWith('lifeplate:visit-draft:'));
      return { drafts, pointer: localStorage.getItem('lifeplate:offline-user'), id };
    }, firstUser);
    expect(left).toEqual({ drafts: [], pointer: null, id: firstUser });

    // The second technician on the same phone, with no signal: the first one's record is not there to read.
    const second = await insertMember(fx.server.ctx.db, { companyId: fx.t.company.id, role: 'technician' });
    await signInAsMember(page, fx.server.baseUrl, second.user.email);
    await page.goto(`${fx.server.baseUrl}/`);
    await page.getByRole('link', { name: 'Lifeplate home' }).waitFor();
    await expect.poll(() => savedQueryKeys(page), { timeout: 10_000 }).toContainEqual('["me"]');
    await context.setOffline(true);
    await page.goto(`${fx.server.baseUrl}/appliances/${boiler.id}`);
    await page.getByText(/No signal/).first().waitFor();
    expect(await page.getByText('41 Marlock Hythe').count()).toBe(0);
    expect(await savedQueryKeys(page)).not.toContainEqual(`["appliance","${boiler.id}"]`);
    await context.close();
  });

  it('asks before signing out while a visit started offline has not been sent', async () => {
    const { email } = await bookedSteamBoiler('17 Ostler Garth');
    const { context, page } = await roundSavedOnPhone(email);
    await context.setOffline(true);
    await page.getByRole('link', { name: /Steam boiler/ }).first().click();
    await page.getByRole('button', { name: 'Start the booked visit' }).click();
    await page.waitForURL(/\/visits\/[0-9a-f-]{36}$/);
    await page.getByRole('button', { name: 'Sign out' }).click();
    const ask = page.getByRole('alertdialog', { name: 'One change has not reached the office yet' });
    await ask.waitFor();
    await ask.getByRole('button', { name: 'Stay signed in' }).click();
    await ask.waitFor({ state: 'detached' });
    expect(page.url()).toMatch(/\/visits\/[0-9a-f-]{36}$/);
    await context.close();
  });
});

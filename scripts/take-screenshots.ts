/**
 * `npx tsx scripts/take-screenshots.ts [base URL] [--out docs/screens]`: the "read at a glance" screenshots of
 * docs/screens/README.md, taken from a running demo (`npm start`; default base URL http://127.0.0.1:3000).
 * Debian's Chromium through playwright-core, the service worker blocked so every shot is of the live page.
 * Phone: 360 × 740 CSS px at device scale 1 (isMobile, touch); desk: 1366 × 768. It starts a visit as the demo
 * technician (or continues the one left open) and makes a share link as the manager, so the demo data changes.
 * Writes the PNGs and prints each one's size and the record's page height at 360 px with its sections folded.
 */
import fs from 'node:fs';
import path from 'node:path';
import { RECORD_SECTIONS } from '../shared/glossary/words';
import { chromium, type Browser, type BrowserContextOptions, type Page } from 'playwright-core';

const CHROMIUM = '/usr/bin/chromium';
// The flags of tests/support/browser.ts.
const CHROMIUM_FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const PASSWORD = 'lifeplate-demo';

export const PHONE_SHOT: BrowserContextOptions = { viewport: { width: 360, height: 740 }, deviceScaleFactor: 1, isMobile: true, hasTouch: true, serviceWorkers: 'block' };
export const DESK_SHOT: BrowserContextOptions = { viewport: { width: 1366, height: 768 }, deviceScaleFactor: 1, serviceWorkers: 'block' };

/** Above this a full-page PNG is replaced by the first screen, so each file stays small enough to read in a review. */
const MAX_BYTES = 300 * 1024;

type Shot = { file: string; what: string; bytes: number; fullPage: boolean; pageHeight: number };

const positional = process.argv.slice(2).filter((a, i, all) => !a.startsWith('--') && all[i - 1] !== '--out');
const outFlag = process.argv.indexOf('--out');
const BASE = (positional[0] ?? 'http://127.0.0.1:3000').replace(/\/$/, '');
const OUT = path.resolve(outFlag >= 0 ? process.argv[outFlag + 1] : 'docs/screens');

async function signIn(page: Page, email: string) {
  await page.goto(`${BASE}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Find an appliance' }).waitFor();
}

/** The demo's steam boiler with the most parts coming due (the manager's due list, read through the API). */
async function pickSteamBoiler(page: Page): Promise<string> {
  const due = (await (await page.request.get(`${BASE}/api/due`)).json()) as { items: { appliance: { id: string; kind: string } }[] };
  const counts = new Map<string, number>();
  for (const item of due.items) if (item.appliance.kind === 'steam_boiler') counts.set(item.appliance.id, (counts.get(item.appliance.id) ?? 0) + 1);
  const best = [...counts.entries()].sort((a, b) => b[1] - a[1])[0];
  if (!best) throw new Error('No steam boiler on the due list: is this the demo data?');
  return best[0];
}

async function settle(page: Page) {
  await page.waitForLoadState('networkidle');
  await page.evaluate(() => document.fonts.ready.then(() => undefined));
}

async function shoot(page: Page, file: string, what: string, shots: Shot[]) {
  await settle(page);
  const pageHeight = await page.evaluate(() => document.documentElement.scrollHeight);
  const target = path.join(OUT, file);
  // Pages many screens long (the visit form, the share page's history) are shown by their first screen.
  if (pageHeight > 5000) {
    const first = await page.screenshot();
    fs.writeFileSync(target, first);
    shots.push({ file, what, bytes: first.length, fullPage: false, pageHeight });
    return;
  }
  let fullPage = true;
  // A full-page shot keeps fixed bars where the first screen has them (the phone's bottom bar would sit mid-page):
  // a viewport as tall as the page puts it at the bottom, where the reader sees it.
  const viewport = page.viewportSize()!;
  await page.setViewportSize({ width: viewport.width, height: pageHeight });
  await settle(page);
  let png = await page.screenshot();
  await page.setViewportSize(viewport);
  if (png.length > MAX_BYTES) {
    fullPage = false;
    png = await page.screenshot({ fullPage: false });
  }
  fs.writeFileSync(target, png);
  shots.push({ file, what, bytes: png.length, fullPage, pageHeight });
}

async function withPage<T>(browser: Browser, options: BrowserContextOptions, email: string, run: (page: Page) => Promise<T>): Promise<T> {
  const context = await browser.newContext(options);
  try {
    const page = await context.newPage();
    page.on('console', (m) => {
      // The service worker is blocked on purpose (every shot is of the live page).
      if (/Service Worker registration blocked/.test(m.text())) return;
      if (m.type() === 'error' || m.type() === 'warning') console.warn(`[${email}] console.${m.type()}: ${m.text()}`);
    });
    await signIn(page, email);
    return await run(page);
  } finally {
    await context.close();
  }
}

async function main() {
  fs.mkdirSync(OUT, { recursive: true });
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_FLAGS });
  const shots: Shot[] = [];
  let recordFoldedHeight = 0;
  try {
    const applianceId = await withPage(browser, DESK_SHOT, 'manager@demo.test', async (page) => {
      const id = await pickSteamBoiler(page);
      await page.goto(`${BASE}/appliances/${id}`);
      await page.getByRole('region', { name: RECORD_SECTIONS.history }).waitFor();
      await shoot(page, 'record-manager-desk.png', 'Steam boiler life record, manager, desk', shots);

      await page.goto(`${BASE}/due`);
      await page.getByRole('heading', { level: 1 }).waitFor();
      await shoot(page, 'due-list-manager-desk.png', 'Due list, manager, desk', shots);
      return id;
    });

    const shareUrl = await withPage(browser, PHONE_SHOT, 'manager@demo.test', async (page) => {
      await page.goto(`${BASE}/due`);
      await page.getByRole('heading', { level: 1 }).waitFor();
      await shoot(page, 'due-list-manager-phone.png', 'Due list, manager, phone', shots);

      await page.goto(`${BASE}/appliances/${applianceId}`);
      const share = page.getByRole('region', { name: RECORD_SECTIONS.share });
      await share.locator('summary').click();
      await share.getByLabel('Label (optional)').fill('Screenshots');
      await share.getByRole('button', { name: 'Make a share link' }).click();
      return (await share.getByTestId('new-share-link').innerText()).trim();
    });

    await withPage(browser, PHONE_SHOT, 'tech@demo.test', async (page) => {
      await page.goto(`${BASE}/appliances/${applianceId}`);
      await page.getByRole('region', { name: RECORD_SECTIONS.history }).waitFor();
      await settle(page);
      recordFoldedHeight = await page.evaluate(() => document.documentElement.scrollHeight);
      await shoot(page, 'record-tech-phone.png', 'Steam boiler life record, technician, phone (sections folded)', shots);

      const carryOn = page.getByRole('button', { name: 'Continue visit' });
      if (await carryOn.count()) await carryOn.click();
      else await page.getByRole('button', { name: 'Start visit' }).click();
      await page.waitForURL(/\/visits\//);
      await page.getByRole('heading', { level: 1 }).waitFor();
      await shoot(page, 'visit-tech-phone.png', 'Visit in progress, technician, phone', shots);
    });

    // The homeowner's page needs no sign-in.
    for (const [options, file, what] of [
      [PHONE_SHOT, 'share-homeowner-phone.png', 'Share page, homeowner, phone'],
      [DESK_SHOT, 'share-homeowner-desk.png', 'Share page, homeowner, desk'],
    ] as const) {
      const context = await browser.newContext(options);
      const page = await context.newPage();
      await page.goto(shareUrl.replace(/^https?:\/\/[^/]+/, BASE));
      await page.getByRole('heading', { level: 1 }).waitFor();
      await shoot(page, file, what, shots);
      await context.close();
    }

    await withPage(browser, DESK_SHOT, 'owner@demo.test', async (page) => {
      await page.goto(`${BASE}/catalog`);
      await page.getByRole('heading', { level: 1 }).waitFor();
      await shoot(page, 'catalog-owner-desk.png', 'Parts & checklists, owner, desk', shots);
    });
  } finally {
    await browser.close();
  }
  for (const s of shots) {
    console.log(`${s.file.padEnd(30)} ${(s.bytes / 1024).toFixed(0).padStart(4)} KB  ${s.fullPage ? 'full page' : 'first screen'}  page ${s.pageHeight} px  ${s.what}`);
  }
  console.log(`Record at 360 px, sections folded: ${recordFoldedHeight} px (target < 2,500 px)`);
}

main().then(
  () => process.exit(0),
  (err: unknown) => {
    console.error(err instanceof Error ? (err.stack ?? err.message) : err);
    process.exit(1);
  },
);

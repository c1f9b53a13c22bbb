/**
 * `npx tsx bench/offline.ts [--base-url http://127.0.0.1:3000] [--json]`: the technician's phone with no signal,
 * against a running demo (`npm start`), in Debian's Chromium:
 *  1. app start offline from the service worker with the CPU slowed 4× (CDP Emulation.setCPUThrottlingRate) and no
 *     network: time from reload to the round painted from saved data, median of 5 (target ≤ 1.0 s);
 *  2. IndexedDB bytes per saved record (the record, its timeline and its other saved queries, no photos; target ≤ 50 KB);
 *  3. the outbox replaying 20 visits started with no signal: time until the server has them all, and how many it has.
 * It writes to the demo: 20 draft visits for tech@demo.test (delete the demo data or re-seed to undo).
 * Figures are in docs/performance.md.
 */
import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../server/db/seed/demo-accounts';

const CHROMIUM_FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const arg = (name: string) => {
  const i = process.argv.indexOf(name);
  return i >= 0 ? process.argv[i + 1] : undefined;
};
const baseUrl = arg('--base-url') ?? 'http://127.0.0.1:3000';
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function cookieFor(email: string) {
  const res = await fetch(`${baseUrl}/api/auth/sign-in/email`, { method: 'POST', headers: { 'Content-Type': 'application/json', Origin: baseUrl }, body: JSON.stringify({ email, password: DEMO_PASSWORD }) });
  if (!res.ok) throw new Error(`sign-in as ${email} failed: ${res.status}`);
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

/** Bytes of each saved appliance's queries (JSON, as IndexedDB's structured clone holds about the same). */
function savedBytesPerRecord(page: Page) {
  return page.evaluate(async () => {
    const userId = localStorage.getItem('lifeplate:offline-user');
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const req = indexedDB.open(`lifeplate-cache-${userId}`);
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error);
    });
    const saved = await new Promise<{ clientState: { queries: { queryKey: unknown[]; state: unknown }[] } }>((resolve, reject) => {
      const req = db.transaction('queries').objectStore('queries').get('query-cache');
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => reject(req.error);
    });
    db.close();
    const bytes = new Map<string, number>();
    for (const q of saved.clientState.queries) {
      if (q.queryKey[0] !== 'appliance') continue;
      const id = String(q.queryKey[1]);
      bytes.set(id, (bytes.get(id) ?? 0) + new TextEncoder().encode(JSON.stringify(q)).length);
    }
    return [...bytes.values()];
  });
}

async function main() {
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_FLAGS });
  const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, serviceWorkers: 'allow' });
  const page = await context.newPage();
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill('tech@demo.test');
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('link', { name: 'Lifeplate home' }).waitFor();

  // Twenty of the company's appliances, opened once with signal so the phone holds their records.
  const manager = await cookieFor('manager@demo.test');
  const customers = (await (await fetch(`${baseUrl}/api/customers?limit=100`, { headers: { Cookie: manager } })).json()) as { items: { id: string }[] };
  const candidates: string[] = [];
  for (const c of customers.items) {
    const detail = (await (await fetch(`${baseUrl}/api/customers/${c.id}`, { headers: { Cookie: manager } })).json()) as { sites: { appliances: { id: string; status: string }[] }[] };
    for (const site of detail.sites) for (const a of site.appliances) if (a.status !== 'removed') candidates.push(a.id);
  }
  const tech = await cookieFor('tech@demo.test');
  const openDraft = async (id: string) =>
    ((await (await fetch(`${baseUrl}/api/appliances/${id}`, { headers: { Cookie: tech } })).json()) as { openDraftVisitId: string | null }).openDraftVisitId;
  // Appliances with no open draft of this technician's, so each start is a new visit (an earlier run left drafts).
  const ids: string[] = [];
  for (const id of candidates) {
    if (ids.length === 20) break;
    if (!(await openDraft(id))) ids.push(id);
  }
  for (const id of ids) {
    await page.goto(`${baseUrl}/appliances/${id}`);
    await page.getByRole('region', { name: 'What it is' }).waitFor();
    // A technician reads a record for longer than this; the phone saves a second after the answers arrive.
    await page.waitForTimeout(1_200);
  }
  await page.goto(`${baseUrl}/round`);
  await page.getByText(/Saved for offline|Nothing booked/).first().waitFor();
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 60_000 });
  await page.waitForTimeout(2_000);
  const perRecord = await savedBytesPerRecord(page);

  // 1. Start with no network and a slow phone.
  await context.setOffline(true);
  const cdp = await context.newCDPSession(page);
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
  const starts: number[] = [];
  for (let i = 0; i < 5; i++) {
    const t0 = Date.now();
    await page.reload({ waitUntil: 'commit' });
    await page.getByText(/No signal: showing what was saved at|Nothing booked/).first().waitFor();
    starts.push(Date.now() - t0);
  }
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });

  // 3. Twenty visits started with no signal, then signal back.
  for (const [n, id] of ids.entries()) {
    await page.goto(`${baseUrl}/appliances/${id}`);
    try {
      await page.getByRole('button', { name: /^(Start|Continue)/ }).first().click({ timeout: 15_000 });
    } catch (e) {
      await page.screenshot({ path: '/tmp/bench-offline-fail.png' });
      console.error(`record ${n} of ${ids.length} not restored; saved records now: ${(await savedBytesPerRecord(page)).length}, at start ${perRecord.length}`);
      throw e;
    }
    await page.waitForURL(/\/visits\/[0-9a-f-]{36}$/);
  }
  await page.goto(`${baseUrl}/waiting`);
  const queued = await page.locator('ol > li').count();
  const t0 = Date.now();
  await context.setOffline(false);
  await page.getByText('Nothing is waiting').waitFor({ timeout: 120_000 });
  const replayMs = Date.now() - t0;
  const drafts = await Promise.all(ids.map(openDraft));
  await browser.close();

  const result = {
    date: new Date().toISOString(),
    offlineStartMs: { median: median(starts), runs: starts, target: 1000 },
    savedRecordKB: { mean: perRecord.reduce((a, b) => a + b, 0) / perRecord.length / 1024, max: Math.max(...perRecord) / 1024, records: perRecord.length, target: 50 },
    outboxReplay: { queued, replayMs, appliancesWithTheirDraftOnServer: drafts.filter(Boolean).length },
  };
  if (process.argv.includes('--json')) console.log(JSON.stringify(result, null, 2));
  else {
    console.log(`Offline start, 4x CPU, median of 5: ${result.offlineStartMs.median} ms (runs ${starts.join(', ')}; target ≤ 1000 ms)`);
    console.log(`Saved per record: mean ${result.savedRecordKB.mean.toFixed(1)} KB, max ${result.savedRecordKB.max.toFixed(1)} KB over ${perRecord.length} records (target ≤ 50 KB)`);
    console.log(`Outbox: ${queued} queued starts sent in ${replayMs} ms; the server holds a draft for ${result.outboxReplay.appliancesWithTheirDraftOnServer} of ${ids.length} appliances`);
  }
  const out = path.join(import.meta.dirname, 'results', `${result.date.slice(0, 10)}-offline.json`);
  fs.mkdirSync(path.dirname(out), { recursive: true });
  fs.writeFileSync(out, `${JSON.stringify(result, null, 2)}\n`);
}

await main();

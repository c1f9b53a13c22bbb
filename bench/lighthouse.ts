/**
 * `npx tsx bench/lighthouse.ts [--base-url http://127.0.0.1:3000] [--json]`: Lighthouse 12.2.3 in its default mobile
 * mode (a phone-sized screen, simulated slow 4G and a 4× slower CPU) on a life record opened by the technician, signed
 * in, and on a homeowner's share page; prints the accessibility and performance scores and every
 * accessibility audit that failed. Without `--base-url` it starts its own demo app against a throwaway PostgreSQL
 * (bench/client/cli.ts: the demo record with the longest history); with one it uses that running demo (`npm start`):
 * the steam boiler with the most parts due, and a share link made there.
 * Chromium is Debian's, started by this script with --remote-debugging-port; the session cookie goes in Lighthouse's
 * extraHeaders. Figures are in docs/performance.md.
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import lighthouse from 'lighthouse';
import { buildClientIfStale } from '../scripts/lib/client-build';
import { CLIENT_DIST } from '../scripts/lib/paths';
import { DEMO_PASSWORD } from '../server/db/seed/demo-accounts';
import { startDemoApp } from './client/cli';

const CHROMIUM = '/usr/bin/chromium';

const arg = (name: string) => {
  const i = process.argv.indexOf(name);
  return i >= 0 ? process.argv[i + 1] : undefined;
};

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

async function signInCookie(baseUrl: string, email: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: baseUrl },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (!res.ok) throw new Error(`sign-in as ${email} failed: ${res.status}`);
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

/** A running demo: the steam boiler with the most parts due, the technician's cookie, a fresh share link to it. */
async function useRunningDemo(baseUrl: string) {
  const manager = await signInCookie(baseUrl, 'manager@demo.test');
  const due = (await (await fetch(`${baseUrl}/api/due`, { headers: { Cookie: manager } })).json()) as { items: { appliance: { id: string; kind: string } }[] };
  const counts = new Map<string, number>();
  for (const item of due.items) if (item.appliance.kind === 'steam_boiler') counts.set(item.appliance.id, (counts.get(item.appliance.id) ?? 0) + 1);
  const applianceId = [...counts.entries()].sort((a, b) => b[1] - a[1])[0]?.[0];
  if (!applianceId) throw new Error('No steam boiler on the due list: is this the demo data?');
  const made = await fetch(`${baseUrl}/api/appliances/${applianceId}/share-links`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Cookie: manager, Origin: baseUrl },
    body: JSON.stringify({ label: 'Lighthouse', expiresInDays: 7 }),
  });
  if (!made.ok) throw new Error(`share link not made: ${made.status} ${await made.text()}`);
  const { url } = (await made.json()) as { url: string };
  return {
    cookie: await signInCookie(baseUrl, 'tech@demo.test'),
    recordUrl: `${baseUrl}/appliances/${applianceId}`,
    shareUrl: url.replace(/^https?:\/\/[^/]+/, baseUrl),
    close: async () => {},
  };
}

async function launchChromium() {
  const port = await freePort();
  const userDataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-lighthouse-'));
  const child = spawn(
    CHROMIUM,
    ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', `--remote-debugging-port=${port}`, `--user-data-dir=${userDataDir}`, 'about:blank'],
    { stdio: 'ignore' },
  );
  for (let i = 0; i < 100; i++) {
    const ok = await fetch(`http://127.0.0.1:${port}/json/version`).then((r) => r.ok, () => false);
    if (ok) break;
    await new Promise((r) => setTimeout(r, 100));
  }
  return {
    port,
    async close() {
      const exited = new Promise((resolve) => child.once('exit', resolve));
      child.kill();
      await exited;
      fs.rmSync(userDataDir, { recursive: true, force: true, maxRetries: 5 });
    },
  };
}

export type LighthouseFigure = { page: string; accessibility: number; performance: number; metrics: Record<string, string>; failedAccessibility: string[] };

export async function runLighthouse(pages: { page: string; url: string; cookie?: string }[]): Promise<LighthouseFigure[]> {
  const chrome = await launchChromium();
  const figures: LighthouseFigure[] = [];
  try {
    for (const p of pages) {
      const result = await lighthouse(p.url, {
        port: chrome.port,
        output: 'json',
        logLevel: 'error',
        onlyCategories: ['accessibility', 'performance'],
        extraHeaders: p.cookie ? { Cookie: p.cookie } : undefined,
      });
      if (!result) throw new Error(`Lighthouse gave no result for ${p.page}`);
      const { lhr } = result;
      if (lhr.runtimeError) throw new Error(`${p.page}: ${lhr.runtimeError.code} ${lhr.runtimeError.message}`);
      const refs = lhr.categories.accessibility.auditRefs.filter((r) => r.weight > 0);
      const failedAccessibility = refs
        .map((r) => lhr.audits[r.id])
        .filter((a) => a.score !== null && a.score < 1)
        .map((a) => {
          const items = (a.details as { items?: { node?: { snippet?: string; explanation?: string } }[] } | undefined)?.items ?? [];
          return `${a.id}: ${a.title}${items.map((i) => `\n      ${i.node?.snippet ?? ''} ${i.node?.explanation?.split('\n').slice(0, 2).join(' ') ?? ''}`).join('')}`;
        });
      const metrics = Object.fromEntries(
        ['first-contentful-paint', 'largest-contentful-paint', 'total-blocking-time', 'cumulative-layout-shift', 'speed-index'].map((id) => [id, lhr.audits[id]?.displayValue ?? '']),
      );
      figures.push({
        page: p.page,
        metrics,
        accessibility: Math.round((lhr.categories.accessibility.score ?? 0) * 100),
        performance: Math.round((lhr.categories.performance.score ?? 0) * 100),
        failedAccessibility,
      });
    }
  } finally {
    await chrome.close();
  }
  return figures;
}

async function main() {
  const baseUrl = arg('--base-url')?.replace(/\/$/, '');
  let demo;
  if (baseUrl) demo = await useRunningDemo(baseUrl);
  else {
    await buildClientIfStale(CLIENT_DIST);
    demo = await startDemoApp(CLIENT_DIST);
  }
  try {
    const figures = await runLighthouse([
      { page: 'life record (technician, signed in)', url: demo.recordUrl, cookie: demo.cookie },
      { page: 'share page (homeowner, no sign-in)', url: demo.shareUrl },
    ]);
    if (process.argv.includes('--json')) console.log(JSON.stringify(figures, null, 2));
    else {
      for (const f of figures) {
        console.log(`${f.page}: accessibility ${f.accessibility}, performance ${f.performance}`);
        console.log(`  ${Object.entries(f.metrics).map(([k, v]) => `${k} ${v}`).join(', ')}`);
        for (const line of f.failedAccessibility) console.log(`  failed ${line}`);
      }
    }
  } finally {
    await demo.close();
  }
}

main().then(
  () => process.exit(0),
  (err: unknown) => {
    console.error(err instanceof Error ? (err.stack ?? err.message) : err);
    process.exit(1);
  },
);

import os from 'node:os';
import { chromium } from 'playwright-core';
import type { BenchFigure } from '../lib/figure';
import { buildClientIfStale } from '../../scripts/lib/client-build';
import { CLIENT_DIST } from '../../scripts/lib/paths';
import { bundleFigures } from './bundle';
import { coldLoadMedian, median as medianOf, MOBILE_PROFILE } from './cold-load';

const CHROMIUM = '/usr/bin/chromium';
// The flags of tests/support/browser.ts launchBrowser (not imported: that module needs a vitest run).
const CHROMIUM_FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const LCP_TARGET_MS = 2_000;

const median = (values: (number | null)[]) => {
  const known = values.filter((v): v is number => v !== null);
  return known.length ? medianOf(known) : null;
};
const seconds = (ms: number | null) => (ms === null ? '–' : `${(ms / 1000).toFixed(2)} s`);

export type ClientBenchOptions = {
  baseUrl: string;
  /** A signed-in member's `Cookie:` header value, for the record. */
  cookie: string;
  shareUrl: string;
  recordUrl: string;
  /** One run per page instead of five. */
  quick: boolean;
  /** The build the bundle rows are measured from; defaults to dist/client (what `npm start` serves), built if stale. */
  clientDir?: string;
};

const profile = `${MOBILE_PROFILE.latencyMs} ms RTT, ${MOBILE_PROFILE.downloadBitsPerSecond / 1e6} Mbps down, ${MOBILE_PROFILE.uploadBitsPerSecond / 1e3} Kbps up, CPU ${MOBILE_PROFILE.cpuSlowdown}×, cold cache`;

export async function measureClientFigures(opts: ClientBenchOptions): Promise<BenchFigure[]> {
  const clientDir = opts.clientDir ?? CLIENT_DIST;
  if (!opts.clientDir) await buildClientIfStale(clientDir, { quiet: true });
  let rows: BenchFigure[];
  try {
    rows = bundleFigures(clientDir);
  } catch (err) {
    rows = [{ figure: 'Client bundle', load: clientDir, value: null, unit: 'KB', target: 'see budgets', met: null, note: `not measured: ${err instanceof Error ? err.message : String(err)}` }];
  }
  const runs = opts.quick ? 1 : 5;
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_FLAGS });
  try {
    const pages = [
      { figure: "Largest Contentful Paint: homeowner's share page", url: opts.shareUrl, cookie: undefined },
      { figure: "Largest Contentful Paint: technician's record", url: opts.recordUrl, cookie: opts.cookie },
    ];
    for (const p of pages) {
      try {
        const result = await coldLoadMedian(browser, { url: p.url, baseUrl: opts.baseUrl, cookie: p.cookie, ready: 'h1', runs });
        const value = result.medianMs === null ? null : Math.round(result.medianMs) / 1000;
        // The same page with no throttling at all, on the same machine: what the machine itself adds.
        const reference = await coldLoadMedian(browser, { url: p.url, baseUrl: opts.baseUrl, cookie: p.cookie, ready: 'h1', runs, throttle: false });
        rows.push({
          figure: p.figure,
          load: `${profile}; median of ${runs}`,
          value,
          unit: 's',
          target: `≤ ${LCP_TARGET_MS / 1000} s`,
          met: result.medianMs === null ? null : result.medianMs <= LCP_TARGET_MS,
          // The machine's load matters: CPU throttling multiplies whatever else is running.
          note:
            `runs: ${result.runs.map((r) => (r.lcpMs === null ? '–' : (r.lcpMs / 1000).toFixed(2))).join(', ')} s; ` +
            `first byte ${seconds(median(result.runs.map((r) => r.ttfbMs)))}, first paint ${seconds(median(result.runs.map((r) => r.fcpMs)))} (medians); ` +
            `element ${result.runs.at(-1)?.lcpElement ?? 'none'}; load average ${os.loadavg()[0].toFixed(1)} on ${os.cpus().length} cores`,
        });
        rows.push({
          figure: `${p.figure}, unthrottled (reference)`,
          load: `loopback, no network or CPU throttling, cold cache; median of ${runs}`,
          value: reference.medianMs === null ? null : Math.round(reference.medianMs) / 1000,
          unit: 's',
          target: 'reported',
          met: null,
          note: `first byte ${seconds(median(reference.runs.map((r) => r.ttfbMs)))}; load average ${os.loadavg()[0].toFixed(1)} on ${os.cpus().length} cores`,
        });
      } catch (err) {
        rows.push({ figure: p.figure, load: profile, value: null, unit: 's', target: `≤ ${LCP_TARGET_MS / 1000} s`, met: null, note: `not measured: ${err instanceof Error ? err.message.split('\n')[0] : String(err)}` });
      }
    }
  } finally {
    await browser.close();
  }
  return rows;
}

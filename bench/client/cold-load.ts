import type { Browser } from 'playwright-core';

/** The usual mobile lab profile: 150 ms round trip, 1.6 Mbps down, 750 Kbps up, a CPU four times slower. */
export const MOBILE_PROFILE = { latencyMs: 150, downloadBitsPerSecond: 1_600_000, uploadBitsPerSecond: 750_000, cpuSlowdown: 4 } as const;

/** Milestones of one load, in ms from navigation start: first byte of the HTML, first paint of content, the largest paint. */
export type ColdLoadRun = { lcpMs: number | null; lcpElement: string | null; ttfbMs: number | null; fcpMs: number | null };

/** Cookies from a `Cookie:` header value ("a=1; b=2"), set for the app's origin. */
function parseCookieHeader(cookie: string, baseUrl: string) {
  return cookie
    .split(';')
    .map((part) => part.trim())
    .filter(Boolean)
    .map((pair) => {
      const eq = pair.indexOf('=');
      return { name: pair.slice(0, eq), value: pair.slice(eq + 1), url: baseUrl };
    });
}

/**
 * One cold load in a fresh context (empty cache, cache disabled, throttled), returning Largest Contentful Paint.
 * `ready` is a selector that shows the real content has rendered, so the LCP read is the page's and not a spinner's.
 */
export type ColdLoadOptions = {
  url: string;
  baseUrl: string;
  cookie?: string;
  ready: string;
  /** false: no network or CPU throttling, a reference for what the machine itself costs. */
  throttle?: boolean;
};

export async function coldLoadOnce(browser: Browser, opts: ColdLoadOptions): Promise<ColdLoadRun> {
  const context = await browser.newContext({ viewport: { width: 360, height: 740 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true });
  try {
    if (opts.cookie) await context.addCookies(parseCookieHeader(opts.cookie, opts.baseUrl));
    const page = await context.newPage();
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
    if (opts.throttle !== false) {
      await cdp.send('Network.emulateNetworkConditions', {
        offline: false,
        latency: MOBILE_PROFILE.latencyMs,
        // CDP wants bytes per second.
        downloadThroughput: MOBILE_PROFILE.downloadBitsPerSecond / 8,
        uploadThroughput: MOBILE_PROFILE.uploadBitsPerSecond / 8,
      });
      await cdp.send('Emulation.setCPUThrottlingRate', { rate: MOBILE_PROFILE.cpuSlowdown });
    }
    await page.goto(opts.url, { waitUntil: 'load', timeout: 60_000 });
    await page.locator(opts.ready).first().waitFor({ timeout: 60_000 });
    // Let late paints (fonts swapping in, the rest of the record) settle before reading the last LCP candidate.
    await page.waitForLoadState('networkidle', { timeout: 60_000 });
    return await page.evaluate(
      () =>
        new Promise<ColdLoadRun>((resolve) => {
          new PerformanceObserver((list) => {
            const entries = list.getEntries() as (PerformanceEntry & { element?: Element | null })[];
            const last = entries[entries.length - 1];
            const el = last?.element;
            const nav = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming | undefined;
            const fcp = performance.getEntriesByName('first-contentful-paint')[0];
            resolve({
              ttfbMs: nav ? nav.responseStart : null,
              fcpMs: fcp ? fcp.startTime : null,
              lcpMs: last ? last.startTime : null,
              lcpElement: el ? `${el.tagName.toLowerCase()}: ${(el.textContent ?? '').trim().slice(0, 40)}` : null,
            });
          }).observe({ type: 'largest-contentful-paint', buffered: true });
          setTimeout(() => resolve({ lcpMs: null, lcpElement: null, ttfbMs: null, fcpMs: null }), 2_000);
        }),
    );
  } finally {
    await context.close();
  }
}

export const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
};

export async function coldLoadMedian(browser: Browser, opts: ColdLoadOptions & { runs: number }) {
  const runs: ColdLoadRun[] = [];
  for (let i = 0; i < opts.runs; i++) runs.push(await coldLoadOnce(browser, opts));
  const measured = runs.map((r) => r.lcpMs).filter((v): v is number => v !== null);
  return { medianMs: measured.length ? median(measured) : null, runs };
}

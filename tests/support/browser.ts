import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { execFileSync } from 'node:child_process';
import { chromium, type Browser, type BrowserContext, type BrowserContextOptions, type Page } from 'playwright-core';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import { afterAll, afterEach, beforeAll, inject } from 'vitest';
import { buildClientIfStale } from '../../scripts/lib/client-build';
import { PROJECT_ROOT } from '../../scripts/lib/paths';
import { closeContext } from '../../server/build-context';
import { createApp } from '../../server/app';
import { testContext } from './context';
import { createTenant, type Tenant } from './tenant';
import { freePort } from './global-setup';

export const CHROMIUM = '/usr/bin/chromium';
const CHROMIUM_FLAGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** Debian's Chromium, installed with apt-get when missing and we are root; never a downloaded browser. */
export function ensureChromium() {
  if (fs.existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) throw new Error(`Chromium is missing. Install it with: sudo apt-get install -y chromium`);
  execFileSync('apt-get', ['install', '-y', 'chromium'], { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
}

/** What the pages of the running test wrote to the console as errors or warnings, and what they threw. */
const consoleProblems: string[] = [];

// Chromium logs each refused request (a 401 before sign-in, a 404 the page expects) or one cut off (offline) as a
// failed resource; the app's own handling of those is asserted by the tests. A 5xx still counts as a problem.
const expectedFailedResource = /^Failed to load resource: (the server responded with a status of 4\d\d|net::)/;
// Contexts block the app's service worker unless a test opts in (see launchBrowser); Chromium says so in the console.
const blockedServiceWorker = /^Service Worker registration blocked by Playwright/;

function watchConsole(context: BrowserContext) {
  context.on('console', (m) => {
    const type = m.type();
    if ((type === 'error' || type === 'warning') && !expectedFailedResource.test(m.text()) && !blockedServiceWorker.test(m.text())) {
      consoleProblems.push(`console.${type}: ${m.text()} (${m.location().url})`);
    }
  });
  context.on('weberror', (e) => consoleProblems.push(`uncaught: ${e.error().message}`));
}

// Registered by every browser test file that imports this module: a console error or warning fails the test.
afterEach(() => {
  const found = consoleProblems.splice(0);
  if (found.length) throw new Error(`The browser console had errors or warnings:\n${found.join('\n')}`);
});

/** Every context (and so every page) of this browser is watched by the rule above. */
export async function launchBrowser(extraArgs: string[] = []): Promise<Browser> {
  ensureChromium();
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: [...CHROMIUM_FLAGS, ...extraArgs] });
  const newContext = browser.newContext.bind(browser);
  // browser.newPage() makes its context through newContext too. The app's service worker routes every request of the
  // pages it controls, which page.route() cannot see: blocked unless a test is about working offline ('allow').
  browser.newContext = async (options?: BrowserContextOptions) => {
    const context = await newContext({ serviceWorkers: 'block', ...options });
    watchConsole(context);
    return context;
  };
  return browser;
}

export const PHONE: BrowserContextOptions = { viewport: { width: 360, height: 740 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true };

/** The real app (built client + API) on a free loopback port, against the test database. */
export async function startTestServer() {
  const clientDir = process.env.LIFEPLATE_TEST_CLIENT_DIR ?? path.join(PROJECT_ROOT, '.data', 'test-client');
  await buildClientIfStale(clientDir, { quiet: true });
  const port = await freePort();
  const ctx = testContext({ BASE_URL: `http://127.0.0.1:${port}`, PORT: String(port) });
  const server = http.createServer(createApp(ctx, { clientDir }));
  await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
  return {
    ctx,
    baseUrl: `http://127.0.0.1:${port}`,
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await closeContext(ctx);
    },
  };
}

export const screenshotDir = () => path.join(inject('runDir'), 'screenshots');

/** Signs a member in through the real form and waits for their home (the search page). */
export async function signInAsMember(page: Page, baseUrl: string, email: string, password = DEFAULT_TEST_PASSWORD) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Find an appliance' }).waitFor();
}

export type TestServer = Awaited<ReturnType<typeof startTestServer>>;
export type BrowserFixture = { server: TestServer; browser: Browser; t: Tenant };

/** For one test file: the app on a free port, a Chromium, and a fresh tenant; all closed after the file. */
export function useBrowserFixture(): BrowserFixture {
  const fixture = {} as BrowserFixture;
  beforeAll(async () => {
    fixture.server = await startTestServer();
    fixture.browser = await launchBrowser();
    fixture.t = await createTenant(fixture.server.ctx.db);
  });
  afterAll(async () => {
    await fixture.browser?.close();
    await fixture.server?.close();
  });
  return fixture;
}

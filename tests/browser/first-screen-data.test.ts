import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, PHONE, startTestServer } from '../support/browser';
import { createTenant, signIn, type Tenant } from '../support/tenant';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { createApp } from '../../server/app';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let t: Tenant;
let boilerId: string;

beforeAll(async () => {
  server = await startTestServer();
  browser = await launchBrowser();
  t = await createTenant(server.ctx.db);
  const site = await insertSite(server.ctx.db, { companyId: t.company.id, customerId: t.customer.id, street: '8 Millrace Court', town: 'Wrenfield' });
  boilerId = (await insertAppliance(server.ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'steam_boiler', fuel: 'natural_gas' })).id;
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

/** API paths the page asked for, as they were requested. */
function apiCalls(page: Page): string[] {
  const calls: string[] = [];
  page.on('request', (req) => {
    const url = new URL(req.url());
    if (url.pathname.startsWith('/api/')) calls.push(url.pathname);
  });
  return calls;
}

describe('first screen from the HTML', () => {
  it('opens a share link without asking the API for the record', async () => {
    const manager = await signIn(createApp(server.ctx), t.manager.user.email);
    const made = await manager.post(`/api/appliances/${boilerId}/share-links`).send({});
    const url = (made.body.url as string).replace(/^https?:\/\/[^/]+/, server.baseUrl);

    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    const calls = apiCalls(page);
    await page.goto(url);
    await page.getByRole('heading', { name: 'Your steam boiler, natural gas' }).waitFor();
    expect(calls.filter((p) => p.startsWith('/api/share/'))).toEqual([]);
    await context.close();
  });

  it("opens the technician's record without asking for the record or who is signed in", async () => {
    const context = await browser.newContext(PHONE);
    const login = await context.request.post(`${server.baseUrl}/api/auth/sign-in/email`, {
      data: { email: t.technician.user.email, password: DEFAULT_TEST_PASSWORD },
      headers: { Origin: server.baseUrl },
    });
    expect(login.status()).toBe(200);
    const page = await context.newPage();
    const calls = apiCalls(page);
    await page.goto(`${server.baseUrl}/appliances/${boilerId}`);
    await page.getByText('8 Millrace Court', { exact: false }).first().waitFor();
    expect(calls.filter((p) => p === '/api/me' || p === `/api/appliances/${boilerId}`)).toEqual([]);
    await context.close();
  });
});

import { describe, expect, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { PHONE, signInAsMember, useBrowserFixture } from '../support/browser';
import { seriousAxeViolations } from '../support/axe';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { insertBooking } from '../../server/db/factories/bookings';
import { visits } from '../../server/db/schema/index';
import { todayInTimeZone } from '../../shared/dates';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';

const fx = useBrowserFixture();
const DESK = { viewport: { width: 1366, height: 900 } };

/** Each main screen of a role, as that role holds it: the heading it waits for tells the screen has drawn. */
async function auditScreens(page: Page, screens: { path: string; heading: string | RegExp }[]) {
  const found: string[] = [];
  for (const screen of screens) {
    await page.goto(`${fx.server.baseUrl}${screen.path}`);
    await page.getByRole('heading', { name: screen.heading, level: 1 }).first().waitFor();
    await page.waitForLoadState('networkidle');
    found.push(...(await seriousAxeViolations(page)).map((v) => `${screen.path}: ${v}`));
  }
  return found;
}

async function seedRecord() {
  const db = fx.server.ctx.db;
  const companyId = fx.t.company.id;
  const site = await insertSite(db, { companyId, customerId: fx.t.customer.id, street: '8 Sorrel Lane', town: 'Wrenfield' });
  const boiler = await insertAppliance(db, {
    companyId,
    siteId: site.id,
    kind: 'steam_boiler',
    fuel: 'natural_gas',
    components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 }, installedOn: '2016-01-01', conditionFailed: true }],
  });
  await db.insert(visits).values({
    companyId,
    applianceId: boiler.id,
    type: 'annual_maintenance',
    status: 'completed',
    visitedOn: '2025-11-02',
    findings: 'Cleaned the gauge glass; water line steady.',
    outcome: 'left_operating',
    completedAt: new Date('2025-11-02T16:00:00Z'),
  });
  const today = todayInTimeZone(fx.t.company.timeZone);
  await insertBooking(db, {
    companyId,
    siteId: site.id,
    technicianId: fx.t.technician.user.id,
    applianceIds: [boiler.id],
    start: `${today}T23:00`,
    end: `${today}T23:45`,
    timeZone: fx.t.company.timeZone,
  });
  return boiler;
}

async function closeAll(...contexts: BrowserContext[]) {
  for (const c of contexts) await c.close();
}

// Source: WCAG 2.2 level AA, checked by axe-core's rules (only the serious and critical impacts fail the build).
describe('accessibility of the main screens of each role', () => {
  it('the technician’s phone, the office desk, the homeowner and the share page have no serious or critical axe violation', { timeout: 240_000 }, async () => {
    const boiler = await seedRecord();

    const phone = await fx.browser.newContext(PHONE);
    const tech = await phone.newPage();
    await signInAsMember(tech, fx.server.baseUrl, fx.t.technician.user.email);
    const technicianProblems = await auditScreens(tech, [
      { path: '/', heading: 'Find an appliance' },
      { path: '/round', heading: 'Round' },
      { path: `/appliances/${boiler.id}`, heading: /Steam boiler/ },
      { path: '/scan', heading: /Scan/ },
    ]);
    await tech.goto(`${fx.server.baseUrl}/appliances/${boiler.id}`);
    await tech.getByRole('button', { name: /^Start (the booked )?visit$/ }).click();
    await tech.waitForURL(/\/visits\/[0-9a-f-]{36}$/);
    await tech.getByRole('heading', { name: 'Annual maintenance', level: 1 }).waitFor();
    await tech.waitForLoadState('networkidle');
    technicianProblems.push(...(await seriousAxeViolations(tech)).map((v) => `visit editor: ${v}`));

    const desk = await fx.browser.newContext(DESK);
    const office = await desk.newPage();
    await signInAsMember(office, fx.server.baseUrl, fx.t.manager.user.email);
    const officeProblems = await auditScreens(office, [
      { path: '/due', heading: 'Due list' },
      { path: '/week', heading: /Week board/ },
      { path: '/customers', heading: 'Customers' },
      { path: `/appliances/${boiler.id}`, heading: /Steam boiler/ },
      { path: '/service-requests', heading: /Service requests/ },
      { path: '/catalog', heading: /catalog|Parts/i },
      { path: '/tags', heading: /Tags/ },
      { path: '/team', heading: /Team/ },
    ]);
    await office.goto(`${fx.server.baseUrl}/appliances/${boiler.id}`);
    await office.getByRole('region', { name: 'Share with the homeowner' }).locator('summary').click();
    await office.getByRole('button', { name: 'Make a share link' }).click();
    const shareUrl = (await office.getByTestId('new-share-link').textContent())!.trim();

    const home = await fx.browser.newContext(PHONE);
    const owner = await home.newPage();
    await owner.goto(`${fx.server.baseUrl}/sign-in`);
    await owner.getByLabel('E-mail').fill(fx.t.homeowner.user.email);
    await owner.getByLabel('Password').fill(DEFAULT_TEST_PASSWORD);
    await owner.getByRole('button', { name: 'Sign in' }).click();
    await owner.getByRole('heading', { level: 1 }).first().waitFor();
    const homeownerProblems = await auditScreens(owner, [{ path: '/', heading: /./ }]);

    const stranger = await fx.browser.newContext(PHONE);
    const share = await stranger.newPage();
    await share.goto(shareUrl);
    await share.getByRole('heading', { name: /Your steam boiler/ }).waitFor();
    const shareProblems = await seriousAxeViolations(share);

    await closeAll(phone, desk, home, stranger);
    expect({ technicianProblems, officeProblems, homeownerProblems, shareProblems }).toEqual({
      technicianProblems: [],
      officeProblems: [],
      homeownerProblems: [],
      shareProblems: [],
    });
  });
});

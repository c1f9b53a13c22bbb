import { describe, expect, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import { PHONE, signInAsMember, useBrowserFixture } from '../support/browser';
import { runFileAt } from '../support/clock';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { recomputeDueForCompany } from '../../server/modules/due/due.repository';

// A Wednesday noon in the company's zone (New York): the due dates below stay put while the file runs.
runFileAt('2026-11-18T12:00:00-05:00');
const fx = useBrowserFixture();
const DESK = { viewport: { width: 1366, height: 900 } };
const ISO_DATE = /\b\d{4}-\d{2}-\d{2}\b/;

/** Every link and button inside `scope` that is shown: its height and width, to check target sizes. */
async function targetSizes(scope: Locator) {
  return scope.locator('a:visible, button:visible, summary:visible').evaluateAll((els) =>
    els.map((el) => {
      const r = el.getBoundingClientRect();
      return { name: (el.textContent ?? '').trim().slice(0, 40), height: Math.round(r.height), width: Math.round(r.width) };
    }),
  );
}

const jumpBar = (page: Page) => page.getByRole('navigation', { name: 'Due list sections' });

describe('the due list in sections', () => {
  it('opens on the due parts with a jump bar of counted sections, one line per part, the reason on demand, and dates in words', { timeout: 120_000 }, async () => {
    const db = fx.server.ctx.db;
    const companyId = fx.t.company.id;
    // Three gauge glasses last looked at on Dec 3, 2025: inspected every 12 months (common practice), so each is due
    // Dec 3, 2026, in 15 days. The appliances have no annual visit on record, so each is also an annual service due.
    for (const [street, town] of [
      ['3 Quillon Row', 'Wrenfield'],
      ['8 Tansy Court', 'Wrenfield'],
      ['21 Millrace Lane', 'Ashcombe'],
    ]) {
      const site = await insertSite(db, { companyId, customerId: fx.t.customer.id, street, town });
      await insertAppliance(db, {
        companyId,
        siteId: site.id,
        installedOn: '2015-06-01',
        components: [{ typeCode: 'gauge_glass', spec: { lengthIn: 12, diameterIn: 0.625 }, lastInspectedOn: '2025-12-03' }],
      });
    }
    await recomputeDueForCompany(db, companyId);

    const context = await fx.browser.newContext(DESK);
    const page = await context.newPage();
    await signInAsMember(page, fx.server.baseUrl, fx.t.manager.user.email);
    await page.goto(`${fx.server.baseUrl}/due`);
    await page.getByRole('heading', { name: 'Due list', level: 1 }).waitFor();

    // The jump bar names every section with its count.
    const bar = jumpBar(page);
    await bar.getByRole('link', { name: 'Due parts 3' }).waitFor();
    await bar.getByRole('link', { name: 'Stock forecast 3' }).waitFor();
    await bar.getByRole('link', { name: 'Annual services 3' }).waitFor();
    await bar.getByRole('link', { name: 'Replacement prospects 0' }).waitFor();
    await bar.getByRole('link', { name: 'Reminders sent 0' }).waitFor();
    expect(await bar.getByRole('link', { name: /^Due parts/ }).getAttribute('aria-current')).toBe('true');

    // One line per part; the reason is folded until asked for.
    const rows = page.locator('#due-parts tbody tr:visible');
    expect(await rows.count()).toBe(3);
    for (const box of await rows.evaluateAll((els) => els.map((el) => el.getBoundingClientRect().height))) expect(box).toBeLessThan(48);
    const reason = page.getByText(/^Inspection is due/).first();
    expect(await reason.isVisible()).toBe(false);
    const why = rows.first().getByRole('button', { name: /^Why/ });
    expect(await why.getAttribute('aria-expanded')).toBe('false');
    await why.click();
    expect(await rows.first().getByRole('button', { name: /^Hide why/ }).getAttribute('aria-expanded')).toBe('true');
    await reason.waitFor();
    // Worded by the server with the shared formatter: no ISO date anywhere.
    expect(await reason.textContent()).toBe('Inspection is due Dec 3, 2026, in 15 days: every 12 months since last inspection Dec 3, 2025.');
    expect(await page.locator('main').innerText()).not.toMatch(ISO_DATE);

    // At a desk every target is at least 24 px (WCAG 2.2 SC 2.5.8, Target Size (Minimum)).
    const deskTargets = await targetSizes(page.locator('main'));
    // the five jump links, Export CSV, Print, and per row the part, Why and Book (the paging buttons besides)
    expect(deskTargets.length).toBeGreaterThanOrEqual(5 + 2 + 3 * 3);
    for (const t of deskTargets) {
      expect(t.height, t.name).toBeGreaterThanOrEqual(24);
      expect(t.width, t.name).toBeGreaterThanOrEqual(24);
    }

    // The filters still filter, and booking still starts from a row.
    await page.getByLabel('Town').fill('Ashcombe');
    await page.locator('#due-parts tbody tr:visible', { hasText: 'Wrenfield' }).first().waitFor({ state: 'detached' });
    await expect.poll(() => page.locator('#due-parts tbody tr:visible').count()).toBe(1);
    await bar.getByRole('link', { name: 'Due parts 1' }).waitFor();
    await page.getByRole('link', { name: /^Book gauge glass at 21 Millrace Lane$/i }).waitFor();

    // Each section is reached from the bar (and kept in the address); the others are out of the way.
    for (const [name, hash, heading] of [
      [/^Stock forecast/, 'stock-forecast', /^Stock forecast through Feb 16, 2027$/],
      [/^Annual services/, 'annual-services', 'Annual service overdue (3)'],
      [/^Replacement prospects/, 'replacement-prospects', 'Replacement prospects (0)'],
      [/^Reminders sent/, 'reminders-sent', 'Reminders sent'],
    ] as const) {
      await bar.getByRole('link', { name }).click();
      await page.waitForURL(new RegExp(`/due#${hash}$`));
      await page.getByRole('heading', { name: heading }).waitFor();
      expect(await page.locator('#due-parts').isVisible()).toBe(false);
      expect(await page.locator('main').innerText()).not.toMatch(ISO_DATE);
    }
    // Opening a section's address opens that section.
    await page.goto(`${fx.server.baseUrl}/due#annual-services`);
    await page.getByRole('heading', { name: 'Annual service overdue (3)' }).waitFor();
    expect(await page.locator('#annual-services tbody tr:visible').count()).toBe(3);
    await context.close();
  });

  it('on a phone every target of the due list is at least 44 px', { timeout: 60_000 }, async () => {
    const context = await fx.browser.newContext(PHONE);
    const page = await context.newPage();
    await signInAsMember(page, fx.server.baseUrl, fx.t.manager.user.email);
    for (const hash of ['due-parts', 'annual-services']) {
      await page.goto(`${fx.server.baseUrl}/due#${hash}`);
      await page.locator(`#${hash} tbody tr`).first().waitFor();
      await page.waitForLoadState('networkidle');
      const phoneTargets = [...(await targetSizes(jumpBar(page))), ...(await targetSizes(page.locator(`#${hash}`)))];
      expect(phoneTargets.length).toBeGreaterThanOrEqual(5 + 3 * 2);
      for (const t of phoneTargets) {
        expect(t.height, `${hash}: ${t.name}`).toBeGreaterThanOrEqual(44);
        expect(t.width, `${hash}: ${t.name}`).toBeGreaterThanOrEqual(24);
      }
    }
    await context.close();
  });
});

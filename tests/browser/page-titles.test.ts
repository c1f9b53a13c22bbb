import { describe, expect, it } from 'vitest';
import { PHONE, signInAsMember, useBrowserFixture } from '../support/browser';

const fx = useBrowserFixture();

// Source: WCAG 2.2 SC 2.4.2 Page Titled and SC 2.4.1 Bypass Blocks (level A).
describe('page titles and the skip link', () => {
  it('names each page in the tab and lets the keyboard skip the header to the content', async () => {
    const context = await fx.browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await signInAsMember(page, fx.server.baseUrl, fx.t.manager.user.email);
    await page.goto(`${fx.server.baseUrl}/customers`);
    await page.getByRole('heading', { name: 'Customers', level: 1 }).waitFor();
    await expect.poll(() => page.title()).toBe('Customers · Lifeplate');

    await page.keyboard.press('Tab');
    const skip = page.getByRole('link', { name: 'Skip to content' });
    expect(await skip.evaluate((el) => el === document.activeElement)).toBe(true);
    expect(await skip.isVisible()).toBe(true);
    await page.keyboard.press('Enter');
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('main');
    await context.close();
  });
});

describe('dim mode', () => {
  it('follows a dark colour scheme until the Dim button overrides it, and keeps the choice', async () => {
    const context = await fx.browser.newContext({ viewport: { width: 1280, height: 800 }, colorScheme: 'dark' });
    const page = await context.newPage();
    await signInAsMember(page, fx.server.baseUrl, fx.t.manager.user.email);
    await page.goto(`${fx.server.baseUrl}/customers`);
    await page.getByRole('heading', { name: 'Customers', level: 1 }).waitFor();
    const isDim = () => page.evaluate(() => document.documentElement.classList.contains('dim'));
    expect(await isDim()).toBe(true);
    await page.getByRole('button', { name: /Light/ }).click();
    expect(await isDim()).toBe(false);
    await page.reload();
    await page.getByRole('heading', { name: 'Customers', level: 1 }).waitFor();
    expect(await isDim()).toBe(false);
    await context.close();
  });
});

describe('the phone’s navigation', () => {
  it('puts the technician’s four destinations in a bottom bar, the rest under More, and nothing scrolls sideways', async () => {
    const context = await fx.browser.newContext(PHONE);
    const page = await context.newPage();
    await signInAsMember(page, fx.server.baseUrl, fx.t.technician.user.email);
    const bar = page.getByRole('navigation', { name: 'Shortcuts' });
    expect(await page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(false);
    const names = await bar.locator(':scope > div > *').allInnerTexts();
    expect(names.map((n) => n.trim())).toEqual(['Round', 'Find', 'Scan', 'More']);
    // WCAG 2.2 SC 2.5.8 target size: each tab is far above 24 px; common practice for a thumb is about 44 px.
    for (const box of await bar.locator(':scope > div > *').evaluateAll((els) => els.map((e) => e.getBoundingClientRect().height))) {
      expect(box).toBeGreaterThanOrEqual(44);
    }
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);

    await bar.getByRole('button', { name: 'More' }).click();
    await bar.getByRole('link', { name: 'Customers' }).click();
    await page.getByRole('heading', { name: 'Customers', level: 1 }).waitFor();
    expect(await bar.getByRole('link', { name: 'Customers' }).count()).toBe(0);
    await bar.getByRole('link', { name: 'Round' }).click();
    await page.getByRole('heading', { name: 'Round', level: 1 }).waitFor();
    await context.close();
  });
});

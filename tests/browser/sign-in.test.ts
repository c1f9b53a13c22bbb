import { describe, expect, it } from 'vitest';
import { PHONE, useBrowserFixture } from '../support/browser';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';

const fx = useBrowserFixture();

describe('signing in and out in Chromium', () => {
  it('shows field errors, signs a technician in on a phone, and signs out', async () => {
    const context = await fx.browser.newContext(PHONE);
    const page = await context.newPage();
    const failed: string[] = [];
    page.on('requestfailed', (r) => {
      // A fetch cut short by navigating away is not a failure of the app.
      if (r.failure()?.errorText !== 'net::ERR_ABORTED') failed.push(`${r.url()} ${r.failure()?.errorText}`);
    });
    page.on('request', (r) => {
      if (!r.url().startsWith(fx.server.baseUrl) && !r.url().startsWith('data:')) failed.push(`outside request: ${r.url()}`);
    });

    await page.goto(`${fx.server.baseUrl}/team`);
    await page.waitForURL(/\/sign-in\?next=%2Fteam/);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('Enter the e-mail address you sign in with.').waitFor();
    expect(await page.getByRole('alert').count()).toBe(2);

    await page.getByLabel('E-mail').fill(fx.t.technician.user.email);
    await page.getByLabel('Password').fill('wrong-password-here');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('That e-mail and password do not match.').waitFor();

    await page.getByLabel('Password').fill(DEFAULT_TEST_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${fx.server.baseUrl}/team`);
    await page.getByRole('heading', { name: 'Team' }).waitFor();
    await page.getByText(fx.t.owner.user.name).waitFor();
    // A technician sees no company-settings link.
    expect(await page.getByRole('link', { name: 'Company' }).count()).toBe(0);

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.goto(`${fx.server.baseUrl}/`);
    await page.waitForURL(/\/sign-in/);
    expect(failed).toEqual([]);
    await context.close();
  });

  it('shows the owner the company settings and a 404 page for an unknown address', async () => {
    const context = await fx.browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await page.goto(`${fx.server.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(fx.t.owner.user.email);
    await page.getByLabel('Password').fill(DEFAULT_TEST_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Company' }).click();
    await page.getByRole('heading', { name: 'Company settings' }).waitFor();
    await page.goto(`${fx.server.baseUrl}/no/such/page`);
    await page.getByRole('heading', { name: 'Page not found' }).waitFor();
    await context.close();
  });
});

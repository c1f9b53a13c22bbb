import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { signInAsMember, useBrowserFixture } from '../support/browser';
import { runFileAt } from '../support/clock';
import { companies } from '../../server/db/schema/index';

// A Wednesday noon in the company's zone (New York).
runFileAt('2026-11-18T12:00:00-05:00');
const fx = useBrowserFixture();

describe('company settings', () => {
  it('the owner reads today in words and sets the "due soon" window, told on the field when it is out of range', { timeout: 60_000 }, async () => {
    const context = await fx.browser.newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    await signInAsMember(page, fx.server.baseUrl, fx.t.owner.user.email);
    await page.goto(`${fx.server.baseUrl}/settings`);
    await page.getByRole('heading', { name: 'Company settings' }).waitFor();
    await page.getByText(`Today is November 18, 2026 in ${fx.t.company.timeZone}.`).waitFor();

    const field = page.getByLabel('"Due soon" window (days)');
    expect(await field.inputValue()).toBe('60');
    await field.fill('5');
    await page.getByRole('button', { name: 'Save' }).click();
    await page.getByText('At least 7 days.').waitFor();
    expect((await fx.server.ctx.db.select().from(companies).where(eq(companies.id, fx.t.company.id)))[0].dueSoonDays).toBe(60);

    await field.fill('45');
    await page.getByRole('button', { name: 'Save' }).click();
    await page.getByText('Your changes are saved.').waitFor();
    expect((await fx.server.ctx.db.select().from(companies).where(eq(companies.id, fx.t.company.id)))[0].dueSoonDays).toBe(45);
    await context.close();
  });
});

import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { PHONE, signInAsMember, useBrowserFixture } from '../support/browser';
import { parsedMailTo, uniqueEmail } from '../support/outbox';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { customers, visits } from '../../server/db/schema/index';
import { todayInTimeZone } from '../../shared/dates';
import { addMonths } from '../../shared/trade/iso-date';

const fx = useBrowserFixture();

describe('reminder e-mails on screen', () => {
  it('the office sends a reminder from the annual-service list, reads it in the outbox, and the customer stops reminders from the link', async () => {
    const db = fx.server.ctx.db;
    const owner = await insertCustomer(db, { companyId: fx.t.company.id, name: 'Perpetua Quillfeather', email: uniqueEmail() });
    const site = await insertSite(db, { companyId: fx.t.company.id, customerId: owner.id, street: '9 Sorrel Lane', town: 'Wrenfield' });
    const boiler = await insertAppliance(db, { companyId: fx.t.company.id, siteId: site.id, kind: 'hot_water_boiler', fuel: 'natural_gas' });
    const visitedOn = addMonths(todayInTimeZone(fx.t.company.timeZone), -15);
    await db.insert(visits).values({ companyId: fx.t.company.id, applianceId: boiler.id, type: 'annual_maintenance', status: 'completed', visitedOn });

    const office = await fx.browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await office.newPage();
    // The owner: only they may open the development outbox.
    await signInAsMember(page, fx.server.baseUrl, fx.t.owner.user.email);
    await page.goto(`${fx.server.baseUrl}/due`);
    // The due list opens on its due parts; the jump bar leads to the annual services.
    await page.getByRole('navigation', { name: 'Due list sections' }).getByRole('link', { name: /^Annual services \d+$/ }).click();
    await page.waitForURL(/\/due#annual-services$/);
    const row = page.locator('tr', { hasText: owner.name }).first();
    await row.getByRole('button', { name: 'Send reminder' }).click();
    await row.getByText(/Reminder sent [A-Z][a-z]{2} \d{1,2}, \d{4}/).waitFor();
    expect(await row.getByRole('button', { name: 'Send reminder' }).count()).toBe(0);
    await page.getByRole('navigation', { name: 'Due list sections' }).getByRole('link', { name: /^Reminders sent \d+$/ }).click();
    const recent = page.locator('section', { has: page.getByRole('heading', { name: 'Reminders sent' }) });
    await recent.locator('tr', { hasText: owner.name }).getByText('Sent', { exact: true }).waitFor();

    await page.getByRole('link', { name: 'Outbox (dev)' }).click();
    await page.getByRole('heading', { name: 'Outbox (development)' }).waitFor();
    await page.getByText('These links sign you in as someone else').waitFor();
    const message = page.locator('section', { hasText: owner.email! }).first();
    await message.getByText('yearly service was due', { exact: false }).first().waitFor({ state: 'attached' });
    const frame = message.locator('iframe');
    expect(await frame.getAttribute('sandbox')).toBe('');
    expect(await frame.getAttribute('srcdoc')).toContain('Stop reminder e-mails');

    const [mail] = await parsedMailTo(owner.email!);
    const link = /href="([^"]*\/unsubscribe\/[^"]+)"/.exec(String(mail.html))![1];
    expect(link.startsWith(`${fx.server.baseUrl}/unsubscribe/`)).toBe(true);

    // The customer's own phone: no cookies, no sign-in.
    const home = await fx.browser.newContext(PHONE);
    const phone = await home.newPage();
    await phone.goto(link);
    await phone.getByRole('heading', { name: `Stop reminder e-mails from ${fx.t.company.name}?` }).waitFor();
    await phone.getByRole('button', { name: 'Stop reminder e-mails' }).click();
    await phone.getByRole('heading', { name: 'Reminder e-mails stopped' }).waitFor();
    const [stored] = await db.select().from(customers).where(eq(customers.id, owner.id));
    expect(stored.remindersOptOut).toBe(true);

    await phone.goto(`${fx.server.baseUrl}/unsubscribe/not-a-real-token`);
    await phone.getByRole('heading', { name: 'This link does not work' }).waitFor();
    await home.close();
    await office.close();
  });
});

import { describe, expect, it } from 'vitest';
import { PHONE, screenshotDir, signInAsMember, useBrowserFixture } from '../support/browser';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { insertBooking } from '../../server/db/factories/bookings';
import { todayInTimeZone } from '../../shared/dates';
import { addDays } from '../../shared/trade/iso-date';

const fx = useBrowserFixture();

describe('the technician’s round', () => {
  it('shows tomorrow’s booking at 360 px with its access notes, what is due and the load list, and opens the record', async () => {
    const db = fx.server.ctx.db;
    const companyId = fx.t.company.id;
    const customer = await insertCustomer(db, { companyId, name: 'Linnea Oakhollow' });
    const site = await insertSite(db, { companyId, customerId: customer.id, street: '14 Teasel Row', town: 'Marrow Bend', accessNotes: 'Key under the blue pot' });
    const boiler = await insertAppliance(db, {
      companyId,
      siteId: site.id,
      components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 }, installedOn: '2018-01-01', conditionFailed: true }],
    });
    // Tomorrow on the company's calendar, whatever the hour of the run.
    const tomorrow = addDays(todayInTimeZone(fx.t.company.timeZone), 1);
    await insertBooking(db, {
      companyId,
      siteId: site.id,
      technicianId: fx.t.technician.user.id,
      applianceIds: [boiler.id],
      start: `${tomorrow}T09:00`,
      end: `${tomorrow}T11:00`,
      timeZone: fx.t.company.timeZone,
      note: 'Bring the long ladder',
    });

    const phone = await fx.browser.newContext(PHONE);
    const page = await phone.newPage();
    await signInAsMember(page, fx.server.baseUrl, fx.t.technician.user.email);
    await page.goto(`${fx.server.baseUrl}/round`);
    await page.getByRole('heading', { name: 'Round' }).waitFor();
    await page.getByRole('button', { name: 'Tomorrow' }).click();
    const card = page.locator('section', { hasText: 'Linnea Oakhollow' });
    await card.getByText('09:00–11:00', { exact: false }).waitFor();
    await card.getByText('Access: Key under the blue pot').waitFor();
    await card.getByText('Note from the office: Bring the long ladder').waitFor();
    const load = page.locator('section', { has: page.getByRole('heading', { name: 'Load list' }) });
    expect(await load.innerText()).toMatch(/Thermocouple.*× 1/i);
    await page.screenshot({ path: `${screenshotDir()}/round-360.png`, fullPage: true });
    await card.getByRole('link', { name: /Steam boiler/ }).click();
    await page.waitForURL(`**/appliances/${boiler.id}`);
    await phone.close();
  });
});

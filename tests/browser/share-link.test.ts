import { describe, expect, it } from 'vitest';
import { PHONE, signInAsMember, useBrowserFixture } from '../support/browser';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { visits } from '../../server/db/schema/index';

const fx = useBrowserFixture();

describe('share link for the homeowner', () => {
  it('the manager makes a link; a fresh browser opens it without signing in and reads the record; withdrawn, it says so and whom to ask', async () => {
    const site = await insertSite(fx.server.ctx.db, { companyId: fx.t.company.id, customerId: fx.t.customer.id, street: '3 Larkspur Row', town: 'Wrenfield' });
    const boiler = await insertAppliance(fx.server.ctx.db, { companyId: fx.t.company.id, siteId: site.id, kind: 'steam_boiler', fuel: 'natural_gas' });
    await fx.server.ctx.db.insert(visits).values({
      companyId: fx.t.company.id,
      applianceId: boiler.id,
      type: 'annual_maintenance',
      status: 'completed',
      visitedOn: '2026-11-02',
      findings: 'Cleaned the gauge glass; water line steady.',
      internalNotes: 'Office only: do not show',
      outcome: 'left_operating',
      completedAt: new Date('2026-11-02T16:00:00Z'),
    });

    const office = await fx.browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await office.newPage();
    await signInAsMember(page, fx.server.baseUrl, fx.t.manager.user.email);
    await page.goto(`${fx.server.baseUrl}/appliances/${boiler.id}`);
    await page.getByRole('region', { name: 'Share with the homeowner' }).locator('summary').click();
    await page.getByLabel('Label (optional)').fill('sent to the owner');
    await page.getByRole('button', { name: 'Make a share link' }).click();
    const url = (await page.getByTestId('new-share-link').textContent())!.trim();
    expect(url).toMatch(/\/s\/[A-Za-z0-9_-]{43}$/);

    // A fresh context: no cookies, as on the homeowner's own phone.
    const home = await fx.browser.newContext(PHONE);
    const phone = await home.newPage();
    expect(url.startsWith(fx.server.baseUrl)).toBe(true);
    await phone.goto(url);
    await phone.getByRole('heading', { name: 'Your steam boiler, natural gas' }).waitFor();
    await phone.getByText('Cleaned the gauge glass; water line steady.').waitFor();
    await phone.getByText('If no water shows in the gauge glass, do not add any.', { exact: false }).waitFor();
    expect(await phone.getByText('Office only: do not show').count()).toBe(0);
    expect(await phone.getByText(fx.t.customer.name).count()).toBe(0);

    await page.getByRole('button', { name: 'Revoke' }).click();
    await page.getByText('Revoked').waitFor();
    await phone.reload();
    await phone.getByRole('heading', { name: 'This link was withdrawn' }).waitFor();
    await phone.getByText(`${fx.t.company.name} withdrew this link, so the record is no longer shared through it. To see it again, ask ${fx.t.company.name} for a new link: call ${fx.t.company.phone}.`).waitFor();
    expect(await phone.getByText('Cleaned the gauge glass').count()).toBe(0);
    await office.close();
    await home.close();
  });
});

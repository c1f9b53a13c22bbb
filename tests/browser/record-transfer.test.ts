import { describe, expect, it } from 'vitest';
import { PHONE, signInAsMember, useBrowserFixture } from '../support/browser';
import { runFileAt } from '../support/clock';
import { createTenant } from '../support/tenant';
import { DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { appliances, visits } from '../../server/db/schema/index';
import { eq } from 'drizzle-orm';

// Wednesday 3 February 2027, 10:00 in New York, on the server and in the browsers alike.
const NOW = '2027-02-03T10:00:00-05:00';
runFileAt(NOW);

const fx = useBrowserFixture();
const DESKTOP = { viewport: { width: 1366, height: 900 } };

describe('moving a life record to another company', () => {
  it('the homeowner makes a code; the new company looks it up, sees what it holds, copies it and reads the record marked as recorded elsewhere', async () => {
    const db = fx.server.ctx.db;
    const site = await insertSite(db, { companyId: fx.t.company.id, customerId: fx.t.customer.id, street: '9 Tinderwick Lane', town: 'Ebbsworth' });
    const boiler = await insertAppliance(db, {
      companyId: fx.t.company.id,
      siteId: site.id,
      kind: 'steam_boiler',
      fuel: 'natural_gas',
      components: [{ typeCode: 'thermocouple', installedOn: '2020-03-01', spec: { lengthIn: 24 } }],
    });
    await db.insert(visits).values({
      companyId: fx.t.company.id,
      applianceId: boiler.id,
      type: 'annual_maintenance',
      status: 'completed',
      visitedOn: '2026-10-20',
      findings: 'Skimmed the boiler; water line steady.',
      internalNotes: 'Office only: slow payer',
      outcome: 'left_operating',
      completedAt: new Date('2026-10-20T16:00:00Z'),
    });

    // The homeowner, on their phone.
    const home = await fx.browser.newContext(PHONE);
    await home.clock.setFixedTime(new Date(NOW));
    const phone = await home.newPage();
    await phone.goto(`${fx.server.baseUrl}/sign-in`);
    await phone.getByLabel('E-mail').fill(fx.t.homeowner.user.email);
    await phone.getByLabel('Password').fill(DEFAULT_TEST_PASSWORD);
    await phone.getByRole('button', { name: 'Sign in' }).click();
    await phone.getByText('Moving to another heating company?').waitFor();
    await phone.getByRole('button', { name: 'Make a transfer code' }).click();
    const code = (await phone.getByTestId('homeowner-transfer-code').textContent())!.trim();
    expect(code).toMatch(/^[0-9A-HJKMNP-TV-Z]{4}(-[0-9A-HJKMNP-TV-Z]{4}){3}$/);
    await phone.getByText('Works once, until Feb 17, 2027', { exact: false }).waitFor();

    // The new company's manager, at a desk.
    const receiving = await createTenant(db);
    const office = await fx.browser.newContext(DESKTOP);
    await office.clock.setFixedTime(new Date(NOW));
    const desk = await office.newPage();
    await signInAsMember(desk, fx.server.baseUrl, receiving.manager.user.email);
    await desk.getByRole('link', { name: 'Receive a record' }).click();
    await desk.getByRole('heading', { name: 'Receive a transferred record' }).waitFor();

    // A mistyped code is refused beside the field, and nothing is shown.
    await desk.getByLabel('Transfer code').fill('ZZZZ-ZZZZ-ZZZZ-ZZZZ');
    await desk.getByRole('button', { name: 'Look up the code' }).click();
    await desk.getByText('No record transfer has this code', { exact: false }).waitFor();

    await desk.getByLabel('Transfer code').fill(code.toLowerCase());
    await desk.getByRole('button', { name: 'Look up the code' }).click();
    await desk.getByText(`Recorded by ${fx.t.company.name}.`).waitFor();
    expect(await desk.getByTestId('transfer-counts').textContent()).toContain('1 completed visit');
    await desk.getByText(`A new customer: ${fx.t.customer.name}, 9 Tinderwick Lane, Ebbsworth`).waitFor();
    await desk.getByRole('button', { name: 'Copy this record to our company' }).click();
    await desk.getByText('Record received').waitFor();
    await desk.getByRole('link', { name: 'Open the life record' }).click();

    await desk.getByText(`Recorded by another company (${fx.t.company.name}); imported Feb 3, 2027`, { exact: false }).waitFor();
    // History is folded below the record's first screen.
    await desk.getByRole('region', { name: 'History' }).locator('summary').click();
    await desk.getByText('(recorded by another company', { exact: false }).first().waitFor();
    expect(await desk.getByText('Office only: slow payer').count()).toBe(0);
    const [copy] = await db.select().from(appliances).where(eq(appliances.companyId, receiving.company.id));
    expect(desk.url()).toContain(`/appliances/${copy!.id}`);

    // Used once, the code no longer works, not even for the company that just used it.
    await desk.goto(`${fx.server.baseUrl}/receive`);
    await desk.getByLabel('Transfer code').fill(code);
    await desk.getByRole('button', { name: 'Look up the code' }).click();
    await desk.getByText('This code has already been used', { exact: false }).waitFor();

    // The old company keeps its record; its manager sees the code was used, and nothing of the new company.
    const sending = await fx.browser.newContext(DESKTOP);
    await sending.clock.setFixedTime(new Date(NOW));
    const oldDesk = await sending.newPage();
    await signInAsMember(oldDesk, fx.server.baseUrl, fx.t.manager.user.email);
    await oldDesk.goto(`${fx.server.baseUrl}/appliances/${boiler.id}`);
    await oldDesk.getByRole('heading', { name: 'Transfer to another company' }).waitFor();
    await oldDesk.getByText('Used', { exact: true }).waitFor();
    expect(await oldDesk.getByText(receiving.company.name).count()).toBe(0);
    await sending.close();
    await office.close();
    await home.close();
  });
});

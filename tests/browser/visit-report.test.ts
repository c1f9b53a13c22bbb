import { readFile } from 'node:fs/promises';
import { eq } from 'drizzle-orm';
import { PDFDocument } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import { PHONE, signInAsMember, useBrowserFixture } from '../support/browser';
import { parsedMailTo, uniqueEmail } from '../support/outbox';
import { pdfPageText } from '../support/pdf-text';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { customers } from '../../server/db/schema/index';

const fx = useBrowserFixture();

const pdfText = async (bytes: Buffer) => (await PDFDocument.load(bytes)).getPages().map(pdfPageText).join('\n').replace(/\n/g, ' ');

describe('the visit report', () => {
  it('a technician completes a visit on the phone; the homeowner’s e-mail with the report is in the outbox; the homeowner downloads it from the share page', async () => {
    const email = uniqueEmail();
    await fx.server.ctx.db.update(customers).set({ email, remindersOptOut: false }).where(eq(customers.id, fx.t.customer.id));
    const site = await insertSite(fx.server.ctx.db, { companyId: fx.t.company.id, customerId: fx.t.customer.id, street: '21 Fernhollow', town: 'Wrenfield' });
    const boiler = await insertAppliance(fx.server.ctx.db, {
      companyId: fx.t.company.id,
      siteId: site.id,
      kind: 'steam_boiler',
      fuel: 'natural_gas',
      construction: 'cast_iron',
      installedOn: '2004-10-12',
      components: [{ typeCode: 'low_water_cutoff_float' }, { typeCode: 'gauge_glass', spec: { lengthIn: 12, diameterIn: 0.625 } }],
    });

    const tech = await fx.browser.newContext(PHONE);
    const page = await tech.newPage();
    await signInAsMember(page, fx.server.baseUrl, fx.t.technician.user.email);
    await page.goto(`${fx.server.baseUrl}/appliances/${boiler.id}`);
    await page.getByRole('button', { name: 'Start visit' }).click();
    await page.waitForURL(/\/visits\/[0-9a-f-]{36}$/);
    const items = page.locator('li[data-item]');
    await items.first().waitFor();
    const count = await items.count();
    for (let i = 0; i < count; i++) await items.nth(i).getByRole('button', { name: 'Done', exact: true }).click();
    const combustion = page.locator('li[data-item="combustion_test"]');
    await combustion.getByRole('textbox', { name: /^O2/ }).fill('7.5');
    await combustion.getByRole('textbox', { name: /^CO\b/ }).fill('40');
    await combustion.getByRole('textbox', { name: /^Flue temp/ }).fill('410');
    await combustion.getByRole('textbox', { name: /^Air temp/ }).fill('66');
    const lwco = page.locator('li[data-item="lwco_test"]');
    await lwco.getByRole('button', { name: 'Float' }).click();
    await lwco.getByRole('button', { name: /Still visible in the glass/ }).click();
    await lwco.getByRole('button', { name: /Yes, it stopped/ }).click();
    await page.getByRole('button', { name: 'Left operating', exact: true }).click();
    await page.getByText('Everything a completed visit needs is recorded.').waitFor();
    await page.getByRole('button', { name: 'Complete visit' }).click();
    await page.getByRole('status').filter({ hasText: 'Visit completed' }).waitFor();
    await page.getByRole('link', { name: 'Visit report (PDF)' }).waitFor();
    await tech.close();

    // The owner's development outbox lists the report e-mail; the fake's stored copy carries the PDF.
    const office = await fx.browser.newContext({ viewport: { width: 1280, height: 900 } });
    const desk = await office.newPage();
    await signInAsMember(desk, fx.server.baseUrl, fx.t.owner.user.email);
    await desk.goto(`${fx.server.baseUrl}/outbox`);
    await desk.getByText(/^Your visit report, /).first().waitFor();
    await office.close();
    const [mail] = await parsedMailTo(email);
    expect(mail.subject).toMatch(/^Your visit report, /);
    expect(mail.attachments.map((a) => a.contentType)).toEqual(['application/pdf']);
    const attached = await pdfText(mail.attachments[0].content);
    expect(attached).toContain('Steam boiler, natural gas');
    expect(attached).toContain('the burner stopped when the water was lowered');

    // The homeowner opens the link from the e-mail on their phone and downloads the report.
    const link = /https?:\/\/\S+\/s\/[A-Za-z0-9_-]{43}/.exec(mail.text ?? '')![0];
    expect(link.startsWith(fx.server.baseUrl)).toBe(true);
    const home = await fx.browser.newContext({ ...PHONE, acceptDownloads: true });
    const phone = await home.newPage();
    await phone.goto(link);
    await phone.getByRole('heading', { name: 'Your steam boiler, natural gas' }).waitFor();
    const [download] = await Promise.all([phone.waitForEvent('download'), phone.getByRole('link', { name: 'Download the visit report (PDF)' }).first().click()]);
    expect(download.suggestedFilename()).toMatch(/^visit-report-\d{4}-\d{2}-\d{2}\.pdf$/);
    const text = await pdfText(await readFile((await download.path())!));
    expect(text).toContain('Appliance: Steam boiler, natural gas');
    expect(text).toContain('21 Fernhollow, Wrenfield');
    expect(text).toMatch(/Visit report: Annual maintenance, \w+ \d{1,2}, \d{4}/);
    expect(text).toContain('Outcome: Left operating');
    expect(text).toContain('Low-water safety switch (cutoff) test: passed, the burner stopped when the water was lowered, as it should.');
    await home.close();
  });
});

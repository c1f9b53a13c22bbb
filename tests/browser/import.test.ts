import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { and, count, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { appliances, visits } from '../../server/db/schema/index';
import { SAMPLE_IMPORT_HEADERS, sampleImportRows, toCsv } from '../../server/db/factories/import-csv';
import { todayInTimeZone } from '../../shared/dates';
import { screenshotDir, signInAsMember, useBrowserFixture } from '../support/browser';

const fx = useBrowserFixture();

describe('bringing a company\'s spreadsheet in (desktop)', () => {
  it('uploads 300 rows with 5 bad ones, maps two columns by hand, previews the errors, imports and finds a boiler with its past visits', async () => {
    const { db } = fx.server.ctx;
    const companyId = fx.t.company.id;
    const today = todayInTimeZone(fx.t.company.timeZone);
    const rows = sampleImportRows(300, { seed: 21, today });
    for (const [i, col, value] of [[10, 13, '13/31/2004'], [50, 7, 'heat pump'], [120, 8, 'coal'], [200, 1, ''], [299, 18, 'last spring']] as const) rows[i][col] = value;
    // Two columns under names the guess does not know, so the office maps them by hand.
    const headers = SAMPLE_IMPORT_HEADERS.map((h) => (h === 'Customer' ? 'Householder' : h === 'Equipment' ? 'Heating plant' : h));
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-import-')), 'old-office-list.csv');
    fs.writeFileSync(file, toCsv(headers, rows));

    const context = await fx.browser.newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    await signInAsMember(page, fx.server.baseUrl, fx.t.manager.user.email);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Bring records in' }).click();
    await page.getByRole('heading', { name: 'Bring records in' }).waitFor();

    await page.getByLabel('Spreadsheet saved as CSV (up to 20 MB)').setInputFiles(file);
    await page.getByRole('button', { name: 'Read the file' }).click();
    await page.getByText('300 rows, 22 columns').waitFor();
    expect(await page.getByLabel('Customer name (needed)').inputValue()).toBe('');
    expect(await page.getByLabel('Street address (needed)').inputValue()).toBe('Service Address');
    await page.getByLabel('Customer name (needed)').selectOption('Householder');
    await page.getByLabel('Kind of appliance (needed)').selectOption('Heating plant');

    await page.getByRole('button', { name: 'Check the file (nothing is written)' }).click();
    await page.getByRole('heading', { name: '5 rows cannot be imported as they are' }).waitFor();
    const errors = page.getByRole('list', { name: 'Rows with errors' }).getByRole('listitem');
    expect(await errors.allTextContents()).toEqual([
      "row 12, Install Date: '13/31/2004' is not a date; use YYYY-MM-DD, MM/DD/YYYY or a month name such as Jan 6, 2004.",
      "row 52, Heating plant: 'heat pump' is not one we know; use one of: Steam boiler, Hot-water boiler, Water heater, Furnace.",
      "row 122, Fuel Type: 'coal' is not one we know; use one of: Natural gas, Propane, No. 2 oil.",
      'row 202, Householder: is empty; every row needs it.',
      "row 301, Last Service: 'last spring' is not a date; use YYYY-MM-DD, MM/DD/YYYY or a month name such as Jan 6, 2004.",
    ]);
    expect((await db.select({ n: count() }).from(appliances).where(eq(appliances.companyId, companyId)))[0].n).toBe(0);
    await page.screenshot({ path: path.join(screenshotDir(), 'import-preview-1366.png'), fullPage: true });

    await page.getByRole('button', { name: 'Import 295 rows' }).click();
    // 300 rows run in the background: the progress shows until the summary replaces it.
    await page.getByText(/Importing old-office-list\.csv: [\d,]+ of 300 rows/).waitFor();
    await page.getByText('Import finished').waitFor({ timeout: 60_000 });
    await page.getByText('Download the 5 rows to fix').waitFor();
    expect((await db.select({ n: count() }).from(appliances).where(eq(appliances.companyId, companyId)))[0].n).toBe(295);

    const [, name, , , street] = rows[3];
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Find' }).click();
    await page.getByPlaceholder('Name, street, phone or serial').fill(name);
    await page.getByRole('list', { name: 'Results' }).getByText(street).first().click();
    await page.waitForURL(/\/appliances\/[0-9a-f-]{36}$/);
    const applianceId = page.url().split('/').at(-1)!;
    // History is folded below the record's first screen.
    await page.getByRole('region', { name: 'History' }).locator('summary').click();
    await page.getByText(/Brought in from old-office-list\.csv on/).waitFor();
    await expect.poll(async () => page.getByText('(imported from old-office-list.csv)').count()).toBe(2);
    const stored = await db.select().from(visits).where(and(eq(visits.companyId, companyId), eq(visits.applianceId, applianceId)));
    expect(stored).toHaveLength(2);
    await page.screenshot({ path: path.join(screenshotDir(), 'import-record-1366.png'), fullPage: true });
    await context.close();
  });
});

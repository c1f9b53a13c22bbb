import { describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import type { BrowserContext, Page } from 'playwright-core';
import { PHONE, screenshotDir, signInAsMember, useBrowserFixture } from '../support/browser';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { components, partSwaps, visits } from '../../server/db/schema/index';
import { todayInTimeZone } from '../../shared/dates';

const fx = useBrowserFixture();

/** A steam boiler at an invented street, with the parts a steam tune-up touches. */
async function steamBoiler(street: string) {
  const site = await insertSite(fx.server.ctx.db, { companyId: fx.t.company.id, customerId: fx.t.customer.id, street, town: 'Wrenfield' });
  return insertAppliance(fx.server.ctx.db, {
    companyId: fx.t.company.id,
    siteId: site.id,
    kind: 'steam_boiler',
    fuel: 'natural_gas',
    construction: 'cast_iron',
    installedOn: '2004-10-12',
    components: [
      { typeCode: 'thermocouple', spec: { lengthIn: 24 }, installedOn: '2019-11-02' },
      { typeCode: 'low_water_cutoff_float' },
      { typeCode: 'gauge_glass', spec: { lengthIn: 12, diameterIn: 0.625 } },
    ],
  });
}

async function signInOnPhone(): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await fx.browser.newContext(PHONE);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
  page.on('console', (m) => {
    // Chromium logs every refused or cut-off request as a failed resource; the app's own handling is asserted instead.
    if (m.type() === 'error' && !m.text().startsWith('Failed to load resource')) errors.push(`console: ${m.text()}`);
  });
  await signInAsMember(page, fx.server.baseUrl, fx.t.technician.user.email);
  return { context, page, errors };
}

const saveStatus = (page: Page) => page.locator('[data-save-status]');

async function startVisitFromRecord(page: Page) {
  await page.getByRole('button', { name: 'Start visit' }).click();
  await page.waitForURL(/\/visits\/[0-9a-f-]{36}$/);
  return page.url().split('/').pop()!;
}

describe('a technician on a phone', () => {
  it('finds a steam boiler by street, works the checklist, swaps the thermocouple and completes the visit', async () => {
    const boiler = await steamBoiler('88 Cinderwick Row');
    // "Replaced today" is the company's date when the swap reaches the server: between these two, at any hour.
    const todayAtStart = todayInTimeZone(fx.t.company.timeZone);
    const { context, page, errors } = await signInOnPhone();

    await page.getByRole('searchbox').fill('Cinderwick');
    const hit = page.getByRole('link', { name: /88 Cinderwick Row/ });
    await hit.waitFor();
    expect(await hit.textContent()).toContain(fx.t.customer.name);
    expect(await hit.textContent()).toContain(boiler.serial!);
    await hit.click();
    await page.waitForURL(`${fx.server.baseUrl}/appliances/${boiler.id}`);
    await page.getByRole('region', { name: 'What it is' }).getByText(boiler.serial!).waitFor();

    const visitId = await startVisitFromRecord(page);

    // Mark every checklist item done.
    const items = page.locator('li[data-item]');
    await items.first().waitFor();
    const count = await items.count();
    expect(count).toBeGreaterThan(5);
    for (let i = 0; i < count; i++) await items.nth(i).getByRole('button', { name: 'Done', exact: true }).click();
    await page.getByText(`${count} of ${count} marked`).waitFor();

    // Low-water cutoff test: float type, tripped at 1/4 of the glass, burner stopped.
    const lwco = page.locator('li[data-item="lwco_test"]');
    await lwco.getByRole('button', { name: 'Float' }).click();
    await lwco.getByRole('textbox', { name: 'Level in the glass when it tripped' }).fill('1/4');
    await lwco.getByRole('button', { name: /Still visible in the glass/ }).click();
    await lwco.getByRole('button', { name: /Yes, it stopped/ }).click();

    // Gauge glass level, judged live.
    const level = page.locator('li[data-item="water_level"]');
    await level.getByRole('textbox', { name: 'Water level in the gauge glass' }).fill('5/8');
    await level.getByText('Level visible').waitFor();
    await level.getByText('63 % of the glass').waitFor();

    // Combustion typed in °C (a per-phone choice), stored in °F; live results match what the server keeps.
    await page.getByRole('button', { name: '°C' }).click();
    const combustion = page.locator('li[data-item="combustion_test"]');
    await combustion.getByRole('textbox', { name: /^O2/ }).fill('7.5');
    await combustion.getByRole('textbox', { name: /^CO/ }).fill('40');
    await combustion.getByRole('textbox', { name: /^Flue temp/ }).fill('220');
    await combustion.getByRole('textbox', { name: /^Air temp/ }).fill('20');
    const live = combustion.getByRole('region', { name: 'Live combustion results' });
    await live.getByText('CO air-free').waitFor();
    const liveEfficiency = await live.locator('[data-live="Efficiency (HHV)"]').textContent();
    expect(liveEfficiency).toMatch(/^\d+\.\d %$/);

    // Part swap: the thermocouple, why it came out (asked every time, for service-life estimates), then "Replaced today".
    await page.getByRole('button', { name: /^thermocouple/ }).click();
    const sheet = page.getByRole('dialog');
    // The quick reasons are the thermocouple's own (shared/glossary/quick-reasons.ts), none of another part's.
    const quick = sheet.getByRole('group', { name: 'Quick reasons' });
    await quick.getByRole('button', { name: 'low millivolts' }).waitFor();
    expect(await quick.getByRole('button', { name: /glass|nozzle/ }).count()).toBe(0);
    await quick.getByRole('button', { name: 'pilot drops out' }).click();
    await sheet.getByRole('button', { name: 'Replaced today' }).click();
    await sheet.getByText('Say why the old part came out.').waitFor();
    await sheet.getByRole('radio', { name: 'Worn out or failed' }).check();
    await sheet.getByRole('button', { name: 'Replaced today' }).click();
    await page.getByText('✓ thermocouple replaced · pilot drops out').waitFor();
    const [swapRow] = await fx.server.ctx.db.select().from(partSwaps).where(eq(partSwaps.applianceId, boiler.id));
    expect(swapRow).toMatchObject({ cause: 'wear_or_failure', reason: 'pilot drops out' });

    await page.getByRole('textbox', { name: 'Findings' }).fill('Cutoff tripped and stopped the burner. Pilot dropped out; thermocouple replaced.');
    await page.getByRole('button', { name: 'Left operating', exact: true }).click();
    await expect.poll(() => saveStatus(page).getAttribute('data-save-status'), { timeout: 10_000 }).toBe('saved');
    // The server's own results come back with the save.
    const kept = page.getByRole('region', { name: 'Kept with the visit' });
    await kept.getByText('Stopped the burner with water visible in the glass (passed)').waitFor();
    expect(await kept.locator('[data-result="Efficiency (HHV)"]').textContent()).toBe(liveEfficiency);

    await page.getByRole('button', { name: 'Complete visit' }).click();
    const confirmation = page.getByRole('status').filter({ hasText: 'Visit completed' });
    await confirmation.waitFor();
    await confirmation.getByRole('link', { name: 'Back to the life record' }).click();
    await page.waitForURL(`${fx.server.baseUrl}/appliances/${boiler.id}`);

    // History is folded below the first screen; the technician opens it.
    await page.getByRole('region', { name: 'History' }).locator('summary').click();
    const history = page.getByRole('list', { name: 'History, newest first' });
    await history.locator('li[data-kind="visit"]').first().waitFor();
    await history.locator('li[data-kind="part_swap"]').first().waitFor();
    const thermocouple = page.locator('li[data-component="thermocouple"]');
    expect(await thermocouple.count()).toBe(1);
    const todayAtEnd = todayInTimeZone(fx.t.company.timeZone);

    const stored = await fx.server.ctx.db.select().from(visits).where(eq(visits.id, visitId));
    expect(stored[0].status).toBe('completed');
    expect(stored[0].outcome).toBe('left_operating');
    expect(stored[0].readings).toMatchObject({ gaugeGlassLevel: '5/8', lowWaterCutoff: { type: 'float', trippedAtLevel: '1/4', trippedWith: 'water_visible', burnerStopped: true } });
    expect(stored[0].checklist.every((c) => c.mark === 'done')).toBe(true);
    expect(stored[0].readings).toMatchObject({ combustion: { o2Pct: 7.5, coPpm: 40, flueTempF: 428, airTempF: 68 } });
    const parts = await fx.server.ctx.db
      .select()
      .from(components)
      .where(and(eq(components.applianceId, boiler.id), eq(components.typeCode, 'thermocouple')));
    const current = parts.filter((p) => p.removedOn === null);
    const removed = parts.filter((p) => p.removedOn !== null);
    const swappedOn = removed[0]?.removedOn ?? '';
    expect([todayAtStart, todayAtEnd]).toContain(swappedOn);
    expect(current.map((p) => p.installedOn)).toEqual([swappedOn]);
    expect(removed.map((p) => [p.removedOn, p.removalReason])).toEqual([[swappedOn, 'pilot drops out']]);
    const [y, m, d] = swappedOn.split('-').map(Number);
    const swappedShown = new Intl.DateTimeFormat('en-US', { year: 'numeric', month: 'short', day: 'numeric', timeZone: 'UTC' }).format(new Date(Date.UTC(y, m - 1, d)));
    expect(await thermocouple.textContent()).toContain(`Installed ${swappedShown}`);

    expect(errors).toEqual([]);
    await context.close();
  });

  it('is stopped from completing an empty visit: the list shows at the button and the first missing step gets the focus; done properly it completes', async () => {
    const boiler = await steamBoiler('14 Brackenfold');
    const { context, page, errors } = await signInOnPhone();
    await page.goto(`${fx.server.baseUrl}/appliances/${boiler.id}`);
    const visitId = await startVisitFromRecord(page);
    const items = page.locator('li[data-item]');
    await items.first().waitFor();
    const count = await items.count();
    const completes: number[] = [];
    page.on('request', (r) => {
      if (r.method() === 'POST' && r.url().endsWith(`/api/visits/${visitId}/complete`)) completes.push(1);
    });

    // The list is there before anything is pressed, and lists what an empty visit lacks.
    const missing = page.getByRole('region', { name: 'Still needed before completing' });
    await missing.getByText(`Checklist: ${count} steps not marked`).waitFor();
    await missing.getByText('Combustion test:').waitFor();
    await missing.getByText('Low-water cutoff test:').waitFor();
    await missing.getByText('Outcome:').waitFor();

    // What was on screen in the field: O2 25 % and "abc" typed into CO.
    const combustion = page.locator('li[data-item="combustion_test"]');
    await combustion.getByRole('textbox', { name: /^O2/ }).fill('25');
    await combustion.getByRole('textbox', { name: /^CO\b/ }).fill('abc');
    await missing.getByText('O2 must be at least 0 and below 20.9 % (the analyzer O2 range; 20.9 % is air).').waitFor();
    await missing.getByText('Type a number, like 8.5.').waitFor();

    await page.getByRole('button', { name: 'Complete visit' }).click();
    await missing.getByRole('alert').filter({ hasText: 'Not completed yet' }).waitFor();
    expect(await missing.textContent()).toContain(`Checklist: ${count} steps not marked`);
    // The first missing thing, the first checklist step, has the focus, and the screen is still the editor.
    const first = await items.first().getAttribute('data-item');
    await expect.poll(() => page.evaluate(() => document.activeElement?.closest('li[data-item]')?.getAttribute('data-item'))).toBe(first);
    expect(page.url()).toBe(`${fx.server.baseUrl}/visits/${visitId}`);
    await items.first().getByText('Not marked yet').waitFor();
    expect(completes).toEqual([]);
    const [draft] = await fx.server.ctx.db.select().from(visits).where(eq(visits.id, visitId));
    expect(draft).toMatchObject({ status: 'draft', completedAt: null });

    // Jumping from the list to the unreadable CO reading.
    await missing.getByRole('button', { name: /Type a number/ }).click();
    await expect.poll(() => page.evaluate(() => (document.activeElement as HTMLInputElement | null)?.value)).toBe('abc');

    // Now properly: every step, real readings, a required reading skipped with its reason, the outcome.
    for (let i = 0; i < count; i++) await items.nth(i).getByRole('button', { name: 'Done', exact: true }).click();
    await combustion.getByRole('textbox', { name: /^O2/ }).fill('7.5');
    await combustion.getByRole('textbox', { name: /^CO\b/ }).fill('40');
    await combustion.getByRole('textbox', { name: /^Flue temp/ }).fill('410');
    await combustion.getByRole('textbox', { name: /^Air temp/ }).fill('66');
    const lwco = page.locator('li[data-item="lwco_test"]');
    await lwco.getByRole('button', { name: 'Could not take it? Say why' }).click();
    await missing.getByText('Say why the low-water cutoff test was not taken.').waitFor();
    await lwco.getByRole('textbox', { name: 'Why the low-water cutoff test was not taken' }).fill('Boiler cold for a gauge-glass repair; test booked for the return visit.');
    await page.getByRole('button', { name: 'Left operating', exact: true }).click();
    await page.getByText('Everything a completed visit needs is recorded.').waitFor();
    await page.screenshot({ path: `${screenshotDir()}/visit-ready-to-complete-360.png`, fullPage: false });

    await page.getByRole('button', { name: 'Complete visit' }).click();
    const confirmation = page.getByRole('status').filter({ hasText: 'Visit completed' });
    await confirmation.waitFor();
    expect(await confirmation.textContent()).toMatch(/The next annual service is due \w{3} \d{1,2}, \d{4}/);
    await page.getByText('Required readings not taken').waitFor();
    await page.getByText('Low-water cutoff test: Boiler cold for a gauge-glass repair').waitFor();
    expect(page.url()).toBe(`${fx.server.baseUrl}/visits/${visitId}`);
    await page.screenshot({ path: `${screenshotDir()}/visit-completed-360.png`, fullPage: false });

    const [row] = await fx.server.ctx.db.select().from(visits).where(eq(visits.id, visitId));
    expect(row).toMatchObject({ status: 'completed', outcome: 'left_operating', readingSkips: { lowWaterCutoff: 'Boiler cold for a gauge-glass repair; test booked for the return visit.' } });
    expect(row.checklist.every((c) => c.mark === 'done')).toBe(true);
    expect(row.readings).toMatchObject({ combustion: { o2Pct: 7.5, coPpm: 40, flueTempF: 410, airTempF: 66 } });
    expect(completes).toEqual([1]);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('keeps a draft typed without signal on the phone and sends it once, the latest text, when signal returns', async () => {
    const boiler = await steamBoiler('5 Larkspur Cut');
    const { context, page, errors } = await signInOnPhone();
    await page.goto(`${fx.server.baseUrl}/appliances/${boiler.id}`);
    const visitId = await startVisitFromRecord(page);

    const findings = page.getByRole('textbox', { name: 'Findings' });
    await findings.fill('Pilot lit.');
    await expect.poll(() => saveStatus(page).getAttribute('data-save-status'), { timeout: 10_000 }).toBe('saved');
    const [{ revision: savedRevision }] = await fx.server.ctx.db.select({ revision: visits.revision }).from(visits).where(eq(visits.id, visitId));

    await context.setOffline(true);
    const latest = 'Pilot lit. Flue pipe rusted at the elbow; customer told.';
    await findings.fill('Pilot lit. Flue pipe rusted');
    await findings.fill(latest);
    await page.getByText('Saved on this phone — will send when signal returns').waitFor();
    const local = await page.evaluate((id) => JSON.parse(localStorage.getItem(`lifeplate:visit-draft:${id}`) ?? 'null'), visitId);
    expect(local.fields.findings).toBe(latest);
    expect(local.dirty).toBe(true);

    // Signal for the page but not for saves: the draft must come back from this phone after a reload.
    await page.route('**/api/visits/*/draft', (route) => route.abort());
    await context.setOffline(false);
    await page.reload();
    await expect.poll(() => page.getByRole('textbox', { name: 'Findings' }).inputValue(), { timeout: 10_000 }).toBe(latest);
    await page.getByText('Saved on this phone — will send when signal returns').waitFor();

    const puts: { findings?: string; revision?: number }[] = [];
    page.on('request', (r) => {
      if (r.method() === 'PUT' && r.url().endsWith(`/api/visits/${visitId}/draft`)) puts.push(r.postDataJSON());
    });
    await page.unroute('**/api/visits/*/draft');
    // Signal returns: the browser says so.
    await page.evaluate(() => window.dispatchEvent(new Event('online')));
    await expect.poll(() => saveStatus(page).getAttribute('data-save-status'), { timeout: 30_000 }).toBe('saved');
    expect(puts.map((p) => p.findings)).toEqual([latest]);
    const [row] = await fx.server.ctx.db.select().from(visits).where(eq(visits.id, visitId));
    expect(row.findings).toBe(latest);
    expect(row.revision).toBe(savedRevision + 1);
    const after = await page.evaluate((id) => JSON.parse(localStorage.getItem(`lifeplate:visit-draft:${id}`) ?? 'null'), visitId);
    expect(after.dirty).toBe(false);

    // A second "online" with nothing new to send must not send the same state again. Its retry runs on a zero-delay
    // timer, so once a later zero-delay timer has fired it has had its turn; the next edit's save must then be the
    // only request after it (no waiting a while and hoping).
    await page.evaluate(() => {
      window.dispatchEvent(new Event('online'));
      return new Promise((resolve) => setTimeout(resolve, 0));
    });
    const next = `${latest} Relit and watched three cycles.`;
    await findings.fill(next);
    await expect.poll(() => puts.length, { timeout: 10_000 }).toBeGreaterThanOrEqual(2);
    expect(puts.map((p) => p.findings)).toEqual([latest, next]);

    expect(errors).toEqual([]);
    await context.close();
  });

  it('on a revision conflict refetches, keeps what this phone changed on top of the other change, and saves once more', async () => {
    const boiler = await steamBoiler('31 Tallow Yard');
    const { context, page, errors } = await signInOnPhone();
    await page.goto(`${fx.server.baseUrl}/appliances/${boiler.id}`);
    const visitId = await startVisitFromRecord(page);
    const findings = page.getByRole('textbox', { name: 'Findings' });
    await findings.fill('Burners cleaned.');
    await expect.poll(() => saveStatus(page).getAttribute('data-save-status'), { timeout: 10_000 }).toBe('saved');

    // Another device saves the same draft first.
    const [{ revision }] = await fx.server.ctx.db.select({ revision: visits.revision }).from(visits).where(eq(visits.id, visitId));
    const other = await page.evaluate(
      async ({ id, rev }) =>
        (await fetch(`/api/visits/${id}/draft`, { method: 'PUT', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ revision: rev, recommendations: 'Replace the vent connector.' }) })).status,
      { id: visitId, rev: revision },
    );
    expect(other).toBe(200);

    const statuses: number[] = [];
    page.on('response', (r) => {
      if (r.request().method() === 'PUT' && r.url().endsWith(`/api/visits/${visitId}/draft`)) statuses.push(r.status());
    });
    await findings.fill('Burners cleaned. Pilot adjusted.');
    await expect.poll(() => statuses, { timeout: 10_000 }).toEqual([409, 200]);
    await expect.poll(() => saveStatus(page).getAttribute('data-save-status'), { timeout: 10_000 }).toBe('saved');
    expect(await page.getByRole('textbox', { name: 'Recommendations' }).inputValue()).toBe('Replace the vent connector.');

    const [row] = await fx.server.ctx.db.select().from(visits).where(eq(visits.id, visitId));
    expect(row.findings).toBe('Burners cleaned. Pilot adjusted.');
    expect(row.recommendations).toBe('Replace the vent connector.');
    expect(row.revision).toBe(revision + 2);
    expect(errors).toEqual([]);
    await context.close();
  });
});

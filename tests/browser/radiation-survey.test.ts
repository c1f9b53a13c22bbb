import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import { PHONE, signInAsMember, useBrowserFixture } from '../support/browser';
import { runFileAt } from '../support/clock';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { radiationSurveys, timelineEvents } from '../../server/db/schema/index';

const NOW = '2026-11-18T10:00:00-05:00';
runFileAt(NOW);
const fx = useBrowserFixture();

async function fillRadiator(group: Locator, r: { type: string; columns?: string; tubes?: string; size?: string; heightIn?: string; sections: string; count?: string }) {
  await group.getByLabel('Type').selectOption(r.type);
  if (r.columns) await group.getByLabel('Columns').selectOption(r.columns);
  if (r.tubes) await group.getByLabel('Tubes').selectOption(r.tubes);
  if (r.size) await group.getByLabel('Size').selectOption(r.size);
  if (r.heightIn) await group.getByLabel('Height (in)').selectOption(r.heightIn);
  await group.getByLabel('Sections').fill(r.sections);
  if (r.count) await group.getByLabel('How many alike').fill(r.count);
}

const noSidewaysScroll = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);

describe('radiation survey on a phone', () => {
  it('a technician at 360 px surveys two rooms and three radiators, sees the running total and the sizing, and opens the proposal', async () => {
    const db = fx.server.ctx.db;
    const companyId = fx.t.company.id;
    const site = await insertSite(db, { companyId, customerId: fx.t.customer.id, street: '9 Quillon Terrace', town: 'Ashmere' });
    const boiler = await insertAppliance(db, { companyId, siteId: site.id, kind: 'steam_boiler', inputBtuh: 150_000, grossOutputBtuh: 120_000 });
    await db.insert(timelineEvents).values([
      { companyId, applianceId: boiler.id, occurredAt: new Date('2025-10-02T15:00:00Z'), kind: 'visit', summary: 'Annual maintenance: left operating' },
      { companyId, applianceId: boiler.id, occurredAt: new Date('2026-01-14T15:00:00Z'), kind: 'part_swap', summary: 'Replaced thermocouple, 24 in' },
    ]);

    const context = await fx.browser.newContext(PHONE);
    await context.clock.setFixedTime(new Date(NOW));
    const page = await context.newPage();
    await signInAsMember(page, fx.server.baseUrl, fx.t.technician.user.email);
    await page.goto(`${fx.server.baseUrl}/appliances/${boiler.id}`);
    await page.getByRole('link', { name: 'Radiation survey (sizing a replacement)' }).click();
    await page.getByRole('heading', { name: 'Radiation survey' }).waitFor();

    const form = page.getByRole('form', { name: 'Radiation survey' });
    const room1 = form.getByRole('region', { name: 'Room 1' });
    await room1.getByLabel('Room 1').fill('Parlour');
    // from memory: Holohan, "The Lost Art of Steam Heating": 3-column 38 in = 5 sq ft per section → 10 sections, 50 sq ft.
    await fillRadiator(room1.getByRole('group', { name: 'Radiator 1' }), { type: 'cast_iron_column', columns: '3', heightIn: '38', sections: '10' });
    await expect.poll(() => form.getByTestId('running-total').textContent()).toBe('Total: 50 sq ft EDR');
    await room1.getByRole('button', { name: 'Add a radiator to this room' }).click();
    // from memory: same book: 4-tube 32 in = 3.5 sq ft per section → 8 sections, two alike, 56 sq ft.
    await fillRadiator(room1.getByRole('group', { name: 'Radiator 2' }), { type: 'tube', tubes: '4', heightIn: '32', sections: '8', count: '2' });
    await expect.poll(() => room1.getByTestId('room-edr').textContent()).toBe('Room: 106 sq ft');

    await form.getByRole('button', { name: 'Add a room' }).click();
    const room2 = form.getByRole('region', { name: 'Room 2' });
    await room2.getByLabel('Room 2').fill('Back bedroom');
    // from memory: a 9-A wall section is 9 sq ft → 3 sections, 27 sq ft.
    await fillRadiator(room2.getByRole('group', { name: 'Radiator 1' }), { type: 'wall', size: '9-A', sections: '3' });
    await expect.poll(() => form.getByTestId('running-total').textContent()).toBe('Total: 133 sq ft EDR');

    // One hand: the save button is a full touch target and nothing scrolls sideways.
    const save = form.getByRole('button', { name: 'Save survey' });
    expect((await save.boundingBox())!.height).toBeGreaterThanOrEqual(44);
    expect(await form.getByLabel('Sections').first().getAttribute('inputmode')).toBe('numeric');
    expect(await noSidewaysScroll(page)).toBe(true);
    await save.click();

    await page.getByTestId('total-edr').waitFor();
    expect(await page.getByTestId('total-edr').textContent()).toBe('133 sq ft EDR');
    // Source: ASHRAE Handbook, HVAC Systems and Equipment: 240 Btu/h per sq ft EDR of steam → 31,920 Btu/h.
    expect(await page.getByTestId('net-load').textContent()).toBe('31,920 Btu/h');
    // from memory: I=B=R net ratings assume a 1.333 piping and pickup factor for steam → 42,549 Btu/h gross.
    expect(await page.getByTestId('gross-output').textContent()).toBe('42,549 Btu/h');
    expect(await page.getByTestId('suitable-range').textContent()).toBe('31,920 Btu/h to 39,900 Btu/h');
    expect(await page.getByTestId('nameplate-input').textContent()).toBe('150,000 Btu/h');
    expect(await page.getByTestId('nameplate-output').textContent()).toBe('120,000 Btu/h');
    await page.getByText('A steam boiler is sized to the connected radiation, not to the house’s heat loss').waitFor();
    await page.getByText('A replacement is designed and installed by a licensed installer').waitFor();
    expect(await noSidewaysScroll(page)).toBe(true);

    const [stored] = await db.select().from(radiationSurveys).where(eq(radiationSurveys.applianceId, boiler.id));
    expect(stored).toMatchObject({ system: 'steam', totalEdrSqFt: 133, surveyedOn: '2026-11-18', surveyedBy: fx.t.technician.user.id });

    await page.getByRole('link', { name: 'Replacement proposal' }).click();
    await page.getByRole('heading', { name: 'Replacement proposal' }).waitFor();
    await page.getByTestId('proposal-history').waitFor();
    expect(await page.getByTestId('total-edr').textContent()).toBe('133 sq ft EDR');
    expect(await page.getByTestId('net-load').textContent()).toBe('31,920 Btu/h');
    const history = await page.getByTestId('proposal-history').textContent();
    expect(history).toContain('Replaced thermocouple, 24 in');
    expect(history).toContain('Annual maintenance: left operating');
    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
    await context.close();
  });
});

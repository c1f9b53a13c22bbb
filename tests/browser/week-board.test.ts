import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { screenshotDir, signInAsMember, useBrowserFixture } from '../support/browser';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { insertBooking } from '../../server/db/factories/bookings';
import { insertMember } from '../../server/db/factories/users';
import { bookingAppliances, bookings } from '../../server/db/schema/index';
import { instantOfLocalDateTime, todayInTimeZone } from '../../shared/dates';
import { formatWeekday } from '../../shared/format/dates';
import { addDays, mondayOf } from '../../shared/trade/iso-date';

const fx = useBrowserFixture();
const DESKTOP = { viewport: { width: 1366, height: 900 } };

describe('the week board', () => {
  it('shows two technicians’ bookings, books from the unbooked queue and moves a booking by the keyboard form', async () => {
    const db = fx.server.ctx.db;
    const companyId = fx.t.company.id;
    const tz = fx.t.company.timeZone;
    const second = await insertMember(db, { companyId, role: 'technician', name: 'Oren Sallowfield' });
    const first = fx.t.technician.user;
    // Chromium keeps its own clock, so dates follow the company's today (as tests/browser/round.test.ts does); the
    // board's next week is always wholly ahead of it, so no booking here is refused as past, whatever the day of the run.
    const monday = addDays(mondayOf(todayInTimeZone(tz)), 7);
    const [tuesday, thursday] = [1, 3].map((n) => addDays(monday, n));

    const place = async (name: string, street: string, town: string, assignedTechnicianId?: string) => {
      const customer = await insertCustomer(db, { companyId, name });
      const site = await insertSite(db, { companyId, customerId: customer.id, street, town, assignedTechnicianId });
      return { customer, site };
    };
    const a = await place('Wren Halloway', '3 Sedge Court', 'Marrow Bend');
    const aBoiler = await insertAppliance(db, { companyId, siteId: a.site.id });
    const aBooking = await insertBooking(db, { companyId, siteId: a.site.id, technicianId: first.id, applianceIds: [aBoiler.id], start: `${monday}T09:00`, end: `${monday}T10:30`, timeZone: tz });
    const b = await place('Tamsin Creel', '88 Bittern Way', 'Fenwick Hollow');
    const bHeater = await insertAppliance(db, { companyId, siteId: b.site.id, kind: 'water_heater' });
    await insertBooking(db, { companyId, siteId: b.site.id, technicianId: second.user.id, applianceIds: [bHeater.id], start: `${tuesday}T13:00`, end: `${tuesday}T14:00`, timeZone: tz, status: 'confirmed' });
    // A Sunday booking opens a Sunday column (Monday to Saturday otherwise), so no booking is off the board.
    const sunday = addDays(monday, 6);
    const s = await place('Bram Oakwell', '2 Fern Lane', 'Alder Falls');
    const sBoiler = await insertAppliance(db, { companyId, siteId: s.site.id });
    await insertBooking(db, { companyId, siteId: s.site.id, technicianId: first.id, applianceIds: [sBoiler.id], start: `${sunday}T10:00`, end: `${sunday}T11:00`, timeZone: tz });
    // Overdue and not booked; the site is Oren's.
    const c = await place('Ilse Marchbank', '7 Quarry Steps', 'Alder Falls', second.user.id);
    const cBoiler = await insertAppliance(db, {
      companyId,
      siteId: c.site.id,
      components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 }, installedOn: '2018-01-01', dueOn: '2026-11-02', dueKind: 'replacement' }],
    });

    const context = await fx.browser.newContext(DESKTOP);
    const page = await context.newPage();
    await signInAsMember(page, fx.server.baseUrl, fx.t.manager.user.email);
    await page.getByRole('link', { name: 'Week board' }).click();
    await page.getByRole('heading', { name: 'Week board' }).waitFor();
    expect(await page.title()).toBe('Week board · Lifeplate');
    await page.getByRole('button', { name: 'Next week' }).click();
    const cell = (tech: string, day: string) => page.locator(`td[aria-label="${tech}, ${formatWeekday(day)}"]`);
    await cell(first.name, monday).getByText('Wren Halloway').waitFor();
    await cell(first.name, monday).getByText('09:00–10:30').waitFor();
    await cell(first.name, monday).getByText('Booked').waitFor();
    await cell('Oren Sallowfield', tuesday).getByText('Tamsin Creel').waitFor();
    await cell('Oren Sallowfield', tuesday).getByText('Confirmed').waitFor();
    await cell(first.name, sunday).getByText('Bram Oakwell').waitFor();

    // Book from the queue: Oren is proposed (the site's technician), the window defaults to a steam boiler's 120 minutes.
    await page.getByLabel('Customer, street or town').fill('Marchbank');
    const item = page.getByRole('listitem', { name: /Ilse Marchbank/ });
    await item.getByText('Overdue', { exact: false }).waitFor();
    await item.getByRole('button', { name: /Book Ilse Marchbank/ }).click();
    const form = item.getByRole('form', { name: 'Book a visit' });
    // The team loads after the form opens.
    await expect.poll(() => form.getByLabel('Technician').inputValue()).toBe(second.user.id);
    expect(await form.getByLabel('Window (minutes)').inputValue()).toBe('120');
    await form.getByLabel('Date').fill(tuesday);
    await form.getByText(/Tamsin Creel/).waitFor();
    await form.getByLabel('Start time').fill('08:00');
    await form.getByRole('button', { name: 'Book visit' }).click();
    await page.getByText(/Ilse Marchbank, .* 08:00 with Oren Sallowfield/).waitFor();
    await cell('Oren Sallowfield', tuesday).getByText('Ilse Marchbank').waitFor();
    const [link] = await db.select().from(bookingAppliances).where(eq(bookingAppliances.applianceId, cBoiler.id));
    const [made] = await db.select().from(bookings).where(eq(bookings.id, link.bookingId));
    expect(made).toMatchObject({ technicianId: second.user.id, status: 'booked', startsAt: instantOfLocalDateTime(tz, `${tuesday}T08:00`), endsAt: instantOfLocalDateTime(tz, `${tuesday}T10:00`) });

    // Move Wren's booking to Thursday by keyboard alone.
    await cell(first.name, monday).getByRole('button', { name: 'Move Wren Halloway, 09:00' }).focus();
    await page.keyboard.press('Enter');
    const move = page.getByRole('form', { name: 'Move the booking for Wren Halloway' });
    await move.getByLabel('New date').focus();
    await page.keyboard.type(thursday.slice(5, 7) + thursday.slice(8, 10) + thursday.slice(0, 4));
    await move.getByLabel('New start time').focus();
    await page.keyboard.press('Enter');
    await cell(first.name, thursday).getByText('Wren Halloway').waitFor();
    expect(await cell(first.name, monday).getByText('Wren Halloway').count()).toBe(0);
    const [moved] = await db.select().from(bookings).where(eq(bookings.id, aBooking.id));
    expect(moved.startsAt).toEqual(instantOfLocalDateTime(tz, `${thursday}T09:00`));
    expect(moved.endsAt).toEqual(instantOfLocalDateTime(tz, `${thursday}T10:30`));

    // A move onto Oren's 08:00–10:00 answers 409; the server's words show beside the form and nothing moves.
    await cell(first.name, thursday).getByRole('button', { name: 'Move Wren Halloway, 09:00' }).click();
    const again = page.getByRole('form', { name: 'Move the booking for Wren Halloway' });
    await again.getByLabel('New date').fill(tuesday);
    await again.getByLabel('Technician').selectOption(second.user.id);
    await again.getByRole('button', { name: 'Move booking' }).click();
    await again.getByRole('note').getByText(/This technician is already booked .* at 7 Quarry Steps, Alder Falls/).waitFor();
    expect((await db.select().from(bookings).where(eq(bookings.id, aBooking.id)))[0].technicianId).toBe(first.id);

    await page.screenshot({ path: `${screenshotDir()}/week-board-1366.png`, fullPage: true });
    await context.close();
  });
});

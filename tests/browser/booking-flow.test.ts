import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import ICAL from 'ical.js';
import { simpleParser } from 'mailparser';
import { PHONE, screenshotDir, signInAsMember, useBrowserFixture } from '../support/browser';
import { runFileAt } from '../support/clock';
import { eventually, mailTo, uniqueEmail } from '../support/outbox';
import { fullCompletion } from '../support/visit-completion';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { bookingAppliances, bookings } from '../../server/db/schema/index';
import { instantOfLocalDateTime } from '../../shared/dates';
import { formatWeekday } from '../../shared/format/dates';
import type { VisitDto } from '../../shared/schemas/visits';

// Tuesday 12 January 2027, 07:30 in New York, on the server and in the browser alike (the booking is "today").
const NOW = '2027-01-12T07:30:00-05:00';
const TODAY = '2027-01-12';
runFileAt(NOW);

const fx = useBrowserFixture();
const DESKTOP = { viewport: { width: 1366, height: 900 } };

describe('from the due list to a done booking', () => {
  it('the office books two appliances from the due list and moves the booking; the technician starts and completes both from the round; the homeowner is e-mailed with an .ics', async () => {
    const db = fx.server.ctx.db;
    const companyId = fx.t.company.id;
    const tz = fx.t.company.timeZone;
    const tech = fx.t.technician.user;
    const email = uniqueEmail();
    const customer = await insertCustomer(db, { companyId, name: 'Perrin Ashdown', email });
    const site = await insertSite(db, { companyId, customerId: customer.id, street: '5 Larkspur Lane', town: 'Fenwick Hollow', assignedTechnicianId: tech.id });
    const boiler = await insertAppliance(db, {
      companyId,
      siteId: site.id,
      components: [{ typeCode: 'thermocouple', spec: { lengthIn: 24 }, installedOn: '2019-01-01', dueOn: '2027-01-05', dueKind: 'replacement' }],
    });
    const heater = await insertAppliance(db, {
      companyId,
      siteId: site.id,
      kind: 'water_heater',
      components: [{ typeCode: 'thermocouple', spec: { lengthIn: 18 }, installedOn: '2019-01-01', dueOn: '2027-01-08', dueKind: 'replacement' }],
    });

    // The manager, at a desk.
    const office = await fx.browser.newContext(DESKTOP);
    await office.clock.setFixedTime(new Date(NOW));
    const desk = await office.newPage();
    await signInAsMember(desk, fx.server.baseUrl, fx.t.manager.user.email);
    await desk.getByRole('link', { name: 'Due list' }).click();
    await desk.getByRole('heading', { name: 'Due list' }).waitFor();
    await desk.getByRole('link', { name: 'Book Thermocouple at 5 Larkspur Lane' }).first().click();
    await desk.getByRole('heading', { name: 'Book a visit' }).waitFor();
    const form = desk.getByRole('form', { name: 'Book a visit' });
    // Both appliances at the site are offered; the one booked from is ticked; the site's technician is proposed.
    await form.getByLabel(/Water heater/).check();
    expect(await form.getByLabel('Technician').inputValue()).toBe(tech.id);
    expect(await form.getByLabel('Date').inputValue()).toBe(TODAY);
    await form.getByLabel('Start time').fill('13:00');
    await form.getByRole('button', { name: 'Book visit' }).click();
    await desk.getByText(/13:00–\d\d:\d\d with /).waitFor();

    const [link] = await db.select().from(bookingAppliances).where(eq(bookingAppliances.applianceId, heater.id));
    const booked = await db.select().from(bookingAppliances).where(eq(bookingAppliances.bookingId, link.bookingId));
    expect(booked.map((b) => b.applianceId).sort()).toEqual([boiler.id, heater.id].sort());
    const [row] = await db.select().from(bookings).where(eq(bookings.id, link.bookingId));
    expect(row).toMatchObject({ technicianId: tech.id, status: 'booked', source: 'due_list', startsAt: instantOfLocalDateTime(tz, `${TODAY}T13:00`) });

    // The week board shows it; the office moves it to 10:00 by the keyboard form.
    await desk.getByRole('link', { name: 'Open the week board' }).click();
    await desk.getByRole('heading', { name: 'Week board' }).waitFor();
    const cell = desk.locator(`td[aria-label="${tech.name}, ${formatWeekday(TODAY)}"]`);
    await cell.getByText('Perrin Ashdown').waitFor();
    await cell.getByRole('button', { name: 'Move Perrin Ashdown, 13:00' }).click();
    const move = desk.getByRole('form', { name: 'Move the booking for Perrin Ashdown' });
    await move.getByLabel('New start time').fill('10:00');
    await move.getByLabel('New start time').press('Enter');
    await cell.getByText(/10:00–/).waitFor();
    const [moved] = await db.select().from(bookings).where(eq(bookings.id, row.id));
    expect(moved.startsAt).toEqual(instantOfLocalDateTime(tz, `${TODAY}T10:00`));
    await desk.screenshot({ path: `${screenshotDir()}/booking-flow-week-board.png`, fullPage: true });
    await office.close();

    // The homeowner: one e-mail when booked and one when moved, each with a calendar invitation for the same visit.
    const mails = await eventually(async () => {
      const found = mailTo(email);
      return found.length >= 2 ? Promise.all(found.map((m) => simpleParser(m.raw))) : null;
    });
    const invitations = mails.map((m) => {
      const ics = m.attachments.find((a) => a.filename?.endsWith('.ics'));
      expect(ics, m.subject).toBeDefined();
      const cal = new ICAL.Component(ICAL.parse(ics!.content.toString('utf8')));
      const zone = cal.getFirstSubcomponent('vtimezone');
      if (zone) ICAL.TimezoneService.register(zone);
      const vevent = cal.getFirstSubcomponent('vevent')!;
      return { event: new ICAL.Event(vevent), tzid: String(vevent.getFirstProperty('dtstart')!.getParameter('tzid')) };
    });
    expect(new Set(invitations.map((i) => i.event.uid)).size).toBe(1);
    const latest = invitations.reduce((a, b) => (b.event.sequence > a.event.sequence ? b : a));
    expect(latest.event.startDate.toJSDate()).toEqual(instantOfLocalDateTime(tz, `${TODAY}T10:00`));
    expect(latest.tzid).toBe(tz);

    // The technician, on a phone: today's round with the load list, then each booked appliance started and completed.
    const phone = await fx.browser.newContext(PHONE);
    await phone.clock.setFixedTime(new Date(NOW));
    const page = await phone.newPage();
    await signInAsMember(page, fx.server.baseUrl, tech.email);
    // Home says what the day holds, one tap from the round.
    await page.getByText('1 visit to do today. Next: 10:00, Perrin Ashdown, 5 Larkspur Lane.').waitFor();
    await page.getByRole('link', { name: 'Open the round' }).click();
    await page.getByRole('heading', { name: 'Round' }).waitFor();
    const card = page.locator('section', { hasText: 'Perrin Ashdown' });
    await card.getByText(/10:00–/).first().waitFor();
    const load = page.locator('section', { has: page.getByRole('heading', { name: 'Load list' }) });
    expect(await load.innerText()).toMatch(/thermocouple, 24 in × 1/i);
    expect(await load.innerText()).toMatch(/thermocouple, 18 in × 1/i);
    await page.screenshot({ path: `${screenshotDir()}/booking-flow-round-360.png`, fullPage: true });

    for (const title of [/Steam boiler/, /Water heater/]) {
      await page.goto(`${fx.server.baseUrl}/round`);
      await page.locator('section', { hasText: 'Perrin Ashdown' }).getByRole('link', { name: title }).click();
      await page.getByText(/Next booked visit: Today, 10:00–/).waitFor();
      await page.getByRole('button', { name: 'Start the booked visit' }).click();
      await page.waitForURL(/\/visits\/[0-9a-f-]+$/);
      const visitId = page.url().split('/visits/')[1];
      const visit = (await (await page.request.get(`${fx.server.baseUrl}/api/visits/${visitId}`)).json()) as VisitDto;
      const done = await page.request.post(`${fx.server.baseUrl}/api/visits/${visitId}/complete`, {
        data: fullCompletion(visit),
        headers: { origin: fx.server.baseUrl },
      });
      expect(done.status(), await done.text()).toBe(200);
    }
    const [finished] = await db.select().from(bookings).where(eq(bookings.id, row.id));
    expect(finished.status).toBe('done');
    await page.goto(`${fx.server.baseUrl}/round`);
    await page.locator('section', { hasText: 'Perrin Ashdown' }).getByText('Done').waitFor();
    await phone.close();
  });
});

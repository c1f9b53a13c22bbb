import ICAL from 'ical.js';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bookingNotices, bookings, customers, outgoingMail, serviceRequests, users } from '../../server/db/schema/index';
import { insertAppliance, insertCustomer, insertSite } from '../../server/db/factories/records';
import { insertBooking } from '../../server/db/factories/bookings';
import { bookingRemindersJob } from '../../server/jobs/booking-reminders-job';
import { bookingReplyToken } from '../../server/modules/booking-notices/booking-reply-token';
import { testApp } from '../support/context';
import { runFileAt } from '../support/clock';
import { parsedMailTo, uniqueEmail } from '../support/outbox';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

// The company works in New York; the clock reads Wed Nov 18, 2026, noon there.
runFileAt('2026-11-18T12:00:00-05:00');

const { app, ctx } = testApp();
let t: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;

/** A customer of our own (so the shared SMTP fake's mail can be picked out by address) with one gas boiler. */
async function household(over: { email?: string | null; remindersOptOut?: boolean } = {}) {
  const email = over.email === undefined ? uniqueEmail() : over.email;
  const customer = await insertCustomer(ctx.db, { companyId: t.company.id, name: 'Ada Fenwick', email, remindersOptOut: over.remindersOptOut ?? false });
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: customer.id, street: '4 Quill Lane', town: 'Alder Falls' });
  const boiler = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'hot_water_boiler', fuel: 'natural_gas' });
  return { customer, site, boiler, email: email ?? '' };
}

const book = (applianceId: string, start: string, end: string) =>
  as.manager.post('/api/bookings').send({ applianceIds: [applianceId], technicianId: t.technician.user.id, start, end, source: 'phone' });
const noticesOf = (bookingId: string) => ctx.db.select().from(bookingNotices).where(eq(bookingNotices.bookingId, bookingId));
const storedBooking = (id: string) => ctx.db.select().from(bookings).where(eq(bookings.id, id)).then((r) => r[0]);

type ParsedIcs = { method: string; uid: string; sequence: number; summary: string; tzid: string; start: string; end: string; vtimezone: boolean; attendee: string; status: string };

/** Reads the .ics back with ical.js (an independent parser), turning DTSTART/DTEND into instants through the file's own VTIMEZONE. */
function readIcs(text: string): ParsedIcs {
  const cal = new ICAL.Component(ICAL.parse(text));
  const vtimezone = cal.getFirstSubcomponent('vtimezone');
  if (vtimezone) ICAL.TimezoneService.register(vtimezone);
  const vevent = cal.getFirstSubcomponent('vevent')!;
  const event = new ICAL.Event(vevent);
  return {
    method: String(cal.getFirstPropertyValue('method')),
    uid: event.uid,
    sequence: event.sequence,
    summary: event.summary,
    tzid: String(vevent.getFirstProperty('dtstart')!.getParameter('tzid')),
    start: event.startDate.toJSDate().toISOString(),
    end: event.endDate.toJSDate().toISOString(),
    vtimezone: Boolean(vtimezone),
    // URI schemes are case-insensitive (RFC 3986, 3.1).
    attendee: String(vevent.getFirstPropertyValue('attendee')).replace(/^mailto:/i, 'mailto:'),
    status: String(vevent.getFirstPropertyValue('status')),
  };
}

async function mailsTo(address: string) {
  const mails = await parsedMailTo(address);
  return mails.map((m) => {
    const ics = m.attachments.find((a) => a.filename?.endsWith('.ics'));
    return { subject: m.subject ?? '', text: m.text ?? '', ics: ics ? readIcs(ics.content.toString('utf8')) : null, icsType: ics?.contentType };
  });
}

beforeAll(async () => {
  t = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  await ctx.db.update(users).set({ name: 'Rowan Tarn' }).where(eq(users.id, t.technician.user.id));
});
afterAll(() => ctx.pool.end());

describe('the homeowner’s e-mails about a booking', () => {
  it('booking, moving and cancelling each queue exactly one e-mail with a calendar invitation for the same UID', async () => {
    const h = await household();
    const created = await book(h.boiler.id, '2026-11-24T09:00', '2026-11-24T11:00');
    expect(created.status).toBe(201);
    const id = created.body.id as string;
    const first = await storedBooking(id);
    expect(await noticesOf(id)).toEqual([expect.objectContaining({ kind: 'booked', revision: first.revision, outcome: 'sent', companyId: t.company.id, mailId: expect.any(String) })]);
    const [notice] = await noticesOf(id);
    const [mailRow] = await ctx.db.select().from(outgoingMail).where(eq(outgoingMail.id, notice.mailId!));
    expect(mailRow).toMatchObject({ kind: 'booking_notice', refId: id, companyId: t.company.id, status: 'sent' });

    let mails = await mailsTo(h.email);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Your visit is booked: Tuesday, November 24, 2026, 9:00 AM to 11:00 AM');
    expect(mails[0].text).toContain('Rowan will come');
    expect(mails[0].text).not.toContain('Tarn');
    expect(mails[0].text).toContain('If you smell gas, leave the house');
    expect(mails[0].text).toContain('pets');
    expect(mails[0].icsType).toBe('text/calendar');
    const booked = mails[0].ics!;
    expect(booked).toMatchObject({
      method: 'REQUEST',
      sequence: 0,
      tzid: 'America/New_York',
      vtimezone: true,
      summary: `${t.company.name}: service visit`,
      // Source: 15 U.S.C. 260a: New York is on standard time (UTC−5) in late November.
      start: '2026-11-24T14:00:00.000Z',
      end: '2026-11-24T16:00:00.000Z',
    });
    expect(booked.uid).toContain(id);
    expect(booked).toMatchObject({ attendee: `mailto:${h.email}`, status: 'CONFIRMED' });
    // The development outbox shows the owner the invitation's own text.
    const outbox = await as.owner.get('/api/dev/outbox?limit=200');
    const inOutbox = outbox.body.find((m: { to: string[] }) => m.to.includes(h.email));
    expect(inOutbox.attachments).toEqual([expect.objectContaining({ filename: 'visit.ics', contentType: 'text/calendar', text: expect.stringContaining('METHOD:REQUEST') })]);

    const moved = await as.manager.post(`/api/bookings/${id}/move`).send({ start: '2026-11-25T13:00', end: '2026-11-25T14:30' });
    expect(moved.status).toBe(200);
    const second = await storedBooking(id);
    expect(second.sequence).toBe(1);
    expect((await noticesOf(id)).map((n) => [n.kind, n.revision])).toEqual(expect.arrayContaining([['booked', first.revision], ['moved', second.revision]]));
    mails = await mailsTo(h.email);
    expect(mails).toHaveLength(2);
    const movedMail = mails.find((m) => m.ics?.sequence === 1)!;
    expect(movedMail.subject).toContain('new time');
    expect(movedMail.text).toContain('It was Tuesday, November 24, 2026, 9:00 AM to 11:00 AM');
    expect(movedMail.ics).toMatchObject({ method: 'REQUEST', uid: booked.uid, tzid: 'America/New_York', start: '2026-11-25T18:00:00.000Z', end: '2026-11-25T19:30:00.000Z' });

    const cancelled = await as.manager.post(`/api/bookings/${id}/cancel`).send({ reason: 'Customer away' });
    expect(cancelled.status).toBe(200);
    const third = await storedBooking(id);
    const notices = await noticesOf(id);
    expect(notices).toHaveLength(3);
    expect(notices.find((n) => n.kind === 'cancelled')).toMatchObject({ revision: third.revision, outcome: 'sent', data: expect.objectContaining({ sequence: 2 }) });
    mails = await mailsTo(h.email);
    expect(mails).toHaveLength(3);
    const cancelMail = mails.find((m) => m.ics?.method === 'CANCEL')!;
    expect(cancelMail.ics).toMatchObject({ uid: booked.uid, sequence: 2, start: '2026-11-25T18:00:00.000Z', status: 'CANCELLED' });
    expect(cancelMail.text).not.toContain('/booking-reply/');
  });

  it('confirming a booking sends nothing more', async () => {
    const h = await household();
    const id = (await book(h.boiler.id, '2026-11-26T09:00', '2026-11-26T10:00')).body.id as string;
    expect((await as.manager.post(`/api/bookings/${id}/confirm`)).status).toBe(200);
    expect((await noticesOf(id)).map((n) => n.kind)).toEqual(['booked']);
    expect(await mailsTo(h.email)).toHaveLength(1);
  });

  it('records, and does not send, the e-mail of a customer who opted out or has no address', async () => {
    const optedOut = await household({ remindersOptOut: true });
    const a = (await book(optedOut.boiler.id, '2026-11-27T09:00', '2026-11-27T10:00')).body.id as string;
    expect(await noticesOf(a)).toEqual([expect.objectContaining({ kind: 'booked', outcome: 'opted_out', mailId: null })]);
    expect(await mailsTo(optedOut.email)).toHaveLength(0);
    const noAddress = await household({ email: null });
    const b = (await book(noAddress.boiler.id, '2026-11-27T11:00', '2026-11-27T12:00')).body.id as string;
    expect(await noticesOf(b)).toEqual([expect.objectContaining({ kind: 'booked', outcome: 'no_email', mailId: null })]);
  });

  it('writes no notice when the booking itself is refused', async () => {
    const h = await household();
    const res = await book(h.boiler.id, '2026-11-10T09:00', '2026-11-10T10:00');
    expect(res.status).toBe(400);
    expect(await mailsTo(h.email)).toHaveLength(0);
  });

  it('puts 09:00 on each day the clocks change at the right instant, with the zone named', async () => {
    const h = await household();
    const spring = (await book(h.boiler.id, '2027-03-14T09:00', '2027-03-14T10:00')).body.id as string;
    const autumn = (await book(h.boiler.id, '2027-11-07T09:00', '2027-11-07T10:00')).body.id as string;
    const mails = await mailsTo(h.email);
    const byUid = (id: string) => mails.find((m) => m.ics?.uid.includes(id))!.ics!;
    // Source: 15 U.S.C. 260a: daylight time from the second Sunday in March (UTC−4) to the first Sunday in November (UTC−5).
    expect(byUid(spring)).toMatchObject({ tzid: 'America/New_York', start: '2027-03-14T13:00:00.000Z', end: '2027-03-14T14:00:00.000Z' });
    expect(byUid(autumn)).toMatchObject({ tzid: 'America/New_York', start: '2027-11-07T14:00:00.000Z', end: '2027-11-07T15:00:00.000Z' });
  });
});

describe('the day-before reminder', () => {
  it('reminds each booked or confirmed visit starting tomorrow once, however often the job runs', async () => {
    const h = await household();
    const other = await household();
    const at = (start: string, end: string, over: Partial<typeof bookings.$inferInsert> = {}, site = h) =>
      insertBooking(ctx.db, { companyId: t.company.id, siteId: site.site.id, technicianId: t.technician.user.id, applianceIds: [site.boiler.id], start, end, ...over });
    const tomorrow = await at('2026-11-19T09:00', '2026-11-19T10:00');
    const confirmed = await at('2026-11-19T23:00', '2026-11-19T23:45', { status: 'confirmed' }, other);
    const cancelled = await at('2026-11-19T13:00', '2026-11-19T14:00', { status: 'cancelled' });
    const dayAfter = await at('2026-11-20T00:00', '2026-11-20T01:00');

    await bookingRemindersJob(ctx, { companyIds: [t.company.id] });
    await bookingRemindersJob(ctx, { companyIds: [t.company.id] });

    for (const b of [tomorrow, confirmed]) expect(await noticesOf(b.id)).toEqual([expect.objectContaining({ kind: 'day_before', revision: b.revision, outcome: 'sent' })]);
    for (const b of [cancelled, dayAfter]) expect(await noticesOf(b.id)).toEqual([]);
    const mails = await mailsTo(h.email);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('See you tomorrow: Thursday, November 19, 2026, 9:00 AM to 10:00 AM');
    expect(mails[0].ics).toMatchObject({ method: 'REQUEST', start: '2026-11-19T14:00:00.000Z' });
    expect(await mailsTo(other.email)).toHaveLength(1);
  });
});

describe('“this time does not suit me”', () => {
  it('opens the booking from the e-mail’s link and makes a service request about it for the office', async () => {
    const h = await household();
    const id = (await book(h.boiler.id, '2026-11-30T09:00', '2026-11-30T10:00')).body.id as string;
    const [mail] = await mailsTo(h.email);
    const link = mail.text.match(/http\S+\/booking-reply\/(\S+)/);
    expect(link).not.toBeNull();
    const token = link![1];

    const page = await as.anonymous.get(`/api/booking-reply/${token}`);
    expect(page.status).toBe(200);
    expect(page.headers['cache-control']).toBe('private, no-store');
    expect(page.body).toEqual({
      company: { name: t.company.name, phone: t.company.phone },
      customerName: 'Ada Fenwick',
      booking: expect.objectContaining({ date: '2026-11-30', from: '09:00', to: '10:00', technicianFirstName: 'Rowan', address: '4 Quill Lane, Alder Falls', timeZone: 'America/New_York' }),
    });

    const res = await as.anonymous.post(`/api/booking-reply/${token}`).send({ contactName: 'Ada Fenwick', reason: 'At work that morning', preferredTimes: 'Weekday afternoons' });
    expect(res.status).toBe(201);
    const [row] = await ctx.db.select().from(serviceRequests).where(eq(serviceRequests.id, res.body.id));
    expect(row).toMatchObject({
      via: 'booking_reply',
      aboutBookingId: id,
      applianceId: h.boiler.id,
      customerId: h.customer.id,
      contactEmail: h.email,
      preferredTimes: 'Weekday afternoons',
      status: 'new',
    });
    expect(row.message).toContain('At work that morning');
    // The booking stays as it was until the office moves it.
    expect(await storedBooking(id)).toMatchObject({ status: 'booked' });
  });

  it('answers 400 naming the fields, and 404 for a token we did not sign or a booking that is cancelled', async () => {
    const h = await household();
    const id = (await book(h.boiler.id, '2026-12-01T09:00', '2026-12-01T10:00')).body.id as string;
    const token = bookingReplyToken(ctx.config.BETTER_AUTH_SECRET, id);
    const bad = await as.anonymous.post(`/api/booking-reply/${token}`).send({ contactName: '', reason: '' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.details).sort()).toEqual(['contactName', 'preferredTimes', 'reason']);

    const forged = bookingReplyToken('not-our-secret-but-long-enough-000000', id);
    expect((await as.anonymous.get(`/api/booking-reply/${forged}`)).status).toBe(404);
    expect((await as.anonymous.post(`/api/booking-reply/${forged}`).send({ contactName: 'A', reason: 'b', preferredTimes: 'c' })).status).toBe(404);
    const unknown = bookingReplyToken(ctx.config.BETTER_AUTH_SECRET, crypto.randomUUID());
    expect((await as.anonymous.get(`/api/booking-reply/${unknown}`)).status).toBe(404);

    await as.manager.post(`/api/bookings/${id}/cancel`).send({ reason: 'Customer away' });
    expect((await as.anonymous.get(`/api/booking-reply/${token}`)).status).toBe(404);
    expect(await ctx.db.select().from(serviceRequests).where(and(eq(serviceRequests.aboutBookingId, id)))).toEqual([]);
  });
});

describe('the next booked visit on the homeowner’s pages', () => {
  it('shows on the share page and the homeowner’s record: date, window on the company’s clocks, the technician’s first name', async () => {
    const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
    const boiler = await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id });
    await ctx.db.update(customers).set({ email: uniqueEmail() }).where(eq(customers.id, t.customer.id));
    const link = await as.manager.post(`/api/appliances/${boiler.id}/share-links`).send({ label: 'for the owner' });
    const token = (link.body.url as string).split('/s/')[1];
    expect((await as.anonymous.get(`/api/share/${token}`)).body.nextBooking).toBeNull();

    await book(boiler.id, '2026-12-09T13:00', '2026-12-09T14:30');
    await book(boiler.id, '2026-12-02T08:00', '2026-12-02T09:00');
    const expected = { date: '2026-12-02', from: '08:00', to: '09:00', technicianFirstName: 'Rowan', status: 'booked', timeZone: 'America/New_York', startsAt: '2026-12-02T13:00:00.000Z' };
    const share = await as.anonymous.get(`/api/share/${token}`);
    expect(share.body.nextBooking).toMatchObject(expected);
    expect(JSON.stringify(share.body.nextBooking)).not.toContain('Tarn');
    const own = await as.homeowner.get(`/api/homeowner/appliances/${boiler.id}`);
    expect(own.status).toBe(200);
    expect(own.body.nextBooking).toMatchObject(expected);
  });
});

import { and, count, eq, inArray, isNull, sql, TransactionRollbackError } from 'drizzle-orm';
import type { PgColumn, PgTable } from 'drizzle-orm/pg-core';
import { afterAll, afterEach, describe, expect, it, vi } from 'vitest';
import type { Tx } from '../../server/db/client';
import {
  appliances,
  companies,
  components,
  customers,
  makeupWaterEntries,
  partSwaps,
  sites,
  timelineEvents,
  visits,
} from '../../server/db/schema/index';
import { seedDemo } from '../../server/db/seed/seed-demo';
import { queueDemoBookingConfirmations } from '../../server/db/seed/demo-booking-confirmations';
import { bookingNotices, bookings, outgoingMail } from '../../server/db/schema/index';
import { open } from '../../server/lib/sealed-box';
import type { Mail } from '../../server/lib/mailer';
import { MAIL_SEAL_PURPOSE } from '../../server/modules/mail/mail-queue';
import { serviceLifeService } from '../../server/modules/service-life/service-life.service';
import { DEMO_COMPANY, DEMO_HOMEOWNER, OTHER_COMPANY } from '../../server/db/seed/demo-accounts';
import { todayInTimeZone } from '../../shared/dates';
import { addDays } from '../../shared/trade/iso-date';
import { testApp } from '../support/context';
import { completionRequirements } from '../../shared/visits/completion-requirements';
import type { TradeFlag } from '../../shared/trade/trade-flag';
import { analyzeMakeupWater } from '../../shared/trade/makeup-water';
import { makeupWaterService } from '../../server/modules/makeup-water/makeup-water.service';

const { ctx } = testApp();
afterAll(() => ctx.pool.end());

type Stamped = { table: PgTable & { companyId: PgColumn }; column: PgColumn; label: string };
const stamp = <T extends PgTable & { companyId: PgColumn }>(table: T, label: string, column: (t: T) => PgColumn): Stamped => ({ table, label, column: column(table) });

/** Every instant the seed works out itself (created_at and updated_at are the database's own clock at the write). */
const INSTANTS: Stamped[] = [
  stamp(timelineEvents, 'timeline_events.occurred_at', (t) => t.occurredAt),
  stamp(visits, 'visits.arrived_at', (t) => t.arrivedAt),
  stamp(visits, 'visits.departed_at', (t) => t.departedAt),
  stamp(visits, 'visits.completed_at', (t) => t.completedAt),
  stamp(visits, 'visits.signed_off_at', (t) => t.signedOffAt),
  stamp(visits, 'visits.outcome_told_at', (t) => t.outcomeToldAt),
  stamp(customers, 'customers.created_at', (t) => t.createdAt),
];
const DATES: Stamped[] = [
  stamp(visits, 'visits.visited_on', (t) => t.visitedOn),
  stamp(partSwaps, 'part_swaps.swapped_on', (t) => t.swappedOn),
  stamp(appliances, 'appliances.installed_on', (t) => t.installedOn),
  stamp(components, 'components.installed_on', (t) => t.installedOn),
  stamp(components, 'components.last_inspected_on', (t) => t.lastInspectedOn),
  stamp(components, 'components.removed_on', (t) => t.removedOn),
  stamp(makeupWaterEntries, 'makeup_water_entries.recorded_on', (t) => t.recordedOn),
];

/** What a company's seeded rows hold after `bound` (an instant, or the company's date), and the latest of each. */
async function laterThan(tx: Tx, companyId: string, stamps: Stamped[], bound: ReturnType<typeof sql>) {
  const found: { label: string; latest: string | null; after: number }[] = [];
  for (const s of stamps) {
    const [row] = await tx
      .select({ latest: sql<string | null>`max(${s.column})::text`, after: sql<number>`count(*) filter (where ${s.column} > ${bound})::int` })
      .from(s.table)
      .where(eq(s.table.companyId, companyId));
    found.push({ label: s.label, ...row });
  }
  return found;
}

async function seededAt(tx: Tx, name: string, timeZone: string, now: Date) {
  const [company] = await tx.select().from(companies).where(eq(companies.name, name));
  expect(company.timeZone).toBe(timeZone);
  const today = todayInTimeZone(timeZone, now);
  const instants = await laterThan(tx, company.id, INSTANTS, sql`${now.toISOString()}::timestamptz`);
  const dates = await laterThan(tx, company.id, DATES, sql`${today}::date`);
  // A visit's date is the company's date when the technician arrived.
  const [{ misdated }] = await tx
    .select({ misdated: sql<number>`count(*) filter (where (${visits.arrivedAt} at time zone ${timeZone})::date <> ${visits.visitedOn} or ${visits.departedAt} < ${visits.arrivedAt})::int` })
    .from(visits)
    .where(eq(visits.companyId, company.id));
  const failedParts = await tx
    .select({ dueOn: components.dueOn })
    .from(components)
    .where(and(eq(components.companyId, company.id), eq(components.conditionFailed, true), isNull(components.removedOn)));
  return { today, instants, dates, misdated, failedDueOn: failedParts.map((p) => p.dueOn) };
}

/** Each in-service steam boiler's makeup-water log as the app analyses it (shared/trade/makeup-water.ts, company defaults). */
async function steamLogs(tx: Tx, companyId: string) {
  const steam = await tx
    .select({ id: appliances.id })
    .from(appliances)
    .where(and(eq(appliances.companyId, companyId), eq(appliances.kind, 'steam_boiler'), eq(appliances.status, 'in_service')));
  const entries = await tx.select().from(makeupWaterEntries).where(eq(makeupWaterEntries.companyId, companyId)).orderBy(makeupWaterEntries.recordedOn);
  return steam.map((a) => {
    const log = entries.filter((e) => e.applianceId === a.id);
    const analysis = log.length >= 2 ? analyzeMakeupWater(log.map((e) => ({ date: e.recordedOn, kind: 'meter_reading' as const, gallons: e.gallons! }))) : null;
    return { applianceId: a.id, readings: log.length, analysis, flags: analysis?.flags.map((f) => f.code) ?? [] };
  });
}

/** Seeds the whole demo inside a transaction that is then rolled back, so it can be seeded again at another time. */
async function seedAndRollBack<T>(inspect: (tx: Tx) => Promise<T>): Promise<T> {
  let result: T | undefined;
  await ctx.db
    .transaction(async (tx) => {
      expect(await seedDemo(tx)).toEqual({ seeded: true });
      result = await inspect(tx);
      tx.rollback();
    })
    .catch((e) => {
      if (!(e instanceof TransactionRollbackError)) throw e;
    });
  return result!;
}

// Source: 15 U.S.C. 260a: daylight time runs from 2:00 a.m. on the second Sunday of March to 2:00 a.m. on the first
// Sunday of November (2026-03-08 and 2026-11-01); New York is UTC−5 in winter, UTC−4 in daylight time.
const CLOCKS: [string, string][] = [
  ['00:30 on a winter night', '2026-01-15T00:30:00-05:00'],
  ['06:00 on a winter morning', '2026-01-15T06:00:00-05:00'],
  ['12:00 in summer', '2026-07-15T12:00:00-04:00'],
  ['23:30 in summer (already the next day in UTC)', '2026-07-15T23:30:00-04:00'],
  ['03:30 just after the clocks went forward', '2026-03-08T03:30:00-04:00'],
  ['01:30 in the repeated hour after the clocks went back', '2026-11-01T01:30:00-05:00'],
];

describe('demo seed', () => {
  afterEach(() => vi.useRealTimers());

  // These seed and roll back; they run before the demo below is seeded for good. A whole demo takes a few seconds,
  // longer on a busy machine: the limit only stops a hung run.
  it.each(CLOCKS)('writes nothing that has not happened yet when it runs at %s in the company’s zone', async (_label, at) => {
    const now = new Date(at);
    vi.setSystemTime(now);
    const seen = await seedAndRollBack(async (tx) => {
      const demo = await seededAt(tx, DEMO_COMPANY.name, DEMO_COMPANY.timeZone, now);
      const [company] = await tx.select({ id: companies.id }).from(companies).where(eq(companies.name, DEMO_COMPANY.name));
      return { demo, other: await seededAt(tx, OTHER_COMPANY.name, OTHER_COMPANY.timeZone, now), steam: await steamLogs(tx, company.id) };
    });
    expect(seen.demo.today).toBe(at.slice(0, 10));
    // The small company has no unsafe visit and no feeder meter; the demo company has every kind of stamp, so the
    // check looked at real rows.
    const unwritten = { demo: [], other: ['visits.outcome_told_at', 'makeup_water_entries.recorded_on'] };
    for (const key of ['demo', 'other'] as const) {
      const stamps = [...seen[key].instants, ...seen[key].dates];
      expect(stamps.filter((s) => s.after > 0)).toEqual([]);
      expect(stamps.filter((s) => s.latest === null).map((s) => s.label)).toEqual(unwritten[key]);
      expect(seen[key].misdated).toBe(0);
    }
    // The feeder meters are read at 08:00: this morning's reading, or yesterday's before then.
    const lastReading = seen.demo.dates.find((d) => d.label === 'makeup_water_entries.recorded_on')!.latest;
    expect(lastReading).toBe(now.getTime() >= Date.parse(`${seen.demo.today}T08:00:00${at.slice(-6)}`) ? seen.demo.today : addDays(seen.demo.today, -1));
    // Whenever it is seeded, every steam boiler has a season of weekly readings; one shows the leak, the rest do not.
    expect(seen.steam.length).toBeGreaterThanOrEqual(3);
    expect(Math.min(...seen.steam.map((s) => s.readings))).toBeGreaterThanOrEqual(13);
    expect(seen.steam.filter((s) => s.flags.includes('sharp_rise'))).toHaveLength(1);
    expect(seen.steam.filter((s) => s.flags.length === 0).length).toBe(seen.steam.length - 1);
    // A part failed on condition is due on the company's today, not the database server's.
    expect(seen.demo.failedDueOn.length).toBeGreaterThanOrEqual(1);
    expect(new Set(seen.demo.failedDueOn)).toEqual(new Set([seen.demo.today]));
  }, 60_000);

  const SEEDED_AT = new Date('2026-12-03T08:00:00-05:00');

  it('seeds once; a second run adds nothing', async () => {
    await seedDemo(ctx.db, { now: SEEDED_AT });
    const again = await seedDemo(ctx.db);
    expect(again.seeded).toBe(false);
    const [{ n }] = await ctx.db.select({ n: count() }).from(companies).where(eq(companies.name, DEMO_COMPANY.name));
    expect(n).toBe(1);
  });

  it('fills the demo company with customers, sites, boilers and years of history', async () => {
    const [demo] = await ctx.db.select().from(companies).where(eq(companies.name, DEMO_COMPANY.name));
    const [other] = await ctx.db.select().from(companies).where(eq(companies.name, OTHER_COMPANY.name));
    const countOf = async (table: typeof customers | typeof sites | typeof appliances, companyId: string) =>
      (await ctx.db.select({ n: count() }).from(table).where(eq(table.companyId, companyId)))[0].n;
    expect(await countOf(customers, demo.id)).toBe(36);
    expect(await countOf(sites, demo.id)).toBeGreaterThanOrEqual(40);
    expect(await countOf(appliances, demo.id)).toBeGreaterThanOrEqual(44);
    expect(await countOf(customers, other.id)).toBe(3);
    expect(await countOf(appliances, other.id)).toBe(3);

    const demoAppliances = await ctx.db.select().from(appliances).where(eq(appliances.companyId, demo.id));
    const ids = demoAppliances.map((a) => a.id);
    const visitCounts = await ctx.db
      .select({ applianceId: visits.applianceId, n: count() })
      .from(visits)
      .where(inArray(visits.applianceId, ids))
      .groupBy(visits.applianceId);
    expect(visitCounts).toHaveLength(ids.length);
    expect(Math.max(...visitCounts.map((v) => v.n))).toBeGreaterThanOrEqual(10);

    const unsafe = await ctx.db.select().from(visits).where(and(inArray(visits.applianceId, ids), eq(visits.outcome, 'shut_down_unsafe')));
    expect(unsafe).toHaveLength(1);
    expect(unsafe[0].outcomeReason).toContain('heat exchanger');
    const failedThermocouples = await ctx.db
      .select()
      .from(components)
      .where(and(eq(components.companyId, demo.id), eq(components.typeCode, 'thermocouple'), eq(components.conditionFailed, true), isNull(components.removedOn)));
    expect(failedThermocouples.length).toBeGreaterThanOrEqual(1);
    expect(failedThermocouples[0].dueOn).not.toBeNull();

    const swaps = await ctx.db.select({ n: count() }).from(partSwaps).where(eq(partSwaps.companyId, demo.id));
    expect(swaps[0].n).toBeGreaterThan(50);
    const kinds = await ctx.db
      .select({ kind: timelineEvents.kind })
      .from(timelineEvents)
      .where(eq(timelineEvents.companyId, demo.id))
      .groupBy(timelineEvents.kind);
    expect(kinds.map((k) => k.kind).sort()).toEqual(['install', 'makeup_water', 'part_swap', 'reading', 'status', 'visit']);
    const future = await ctx.db
      .select({ n: count() })
      .from(timelineEvents)
      .where(and(eq(timelineEvents.companyId, demo.id), sql`${timelineEvents.occurredAt} > ${SEEDED_AT.toISOString()}::timestamptz`));
    expect(future[0].n).toBe(0);
    const removed = demoAppliances.filter((a) => a.status === 'removed');
    expect(removed).toHaveLength(1);
    expect(demoAppliances.some((a) => a.id === removed[0].replacedById)).toBe(true);
  });

  it('gives every demo steam boiler a heating season of weekly meter readings: one shows the leak flag, the others a normal small rate', async () => {
    const [demo] = await ctx.db.select().from(companies).where(eq(companies.name, DEMO_COMPANY.name));
    const steam = await ctx.db
      .select({ id: appliances.id })
      .from(appliances)
      .where(and(eq(appliances.companyId, demo.id), eq(appliances.kind, 'steam_boiler'), eq(appliances.status, 'in_service')));
    expect(steam.length).toBeGreaterThanOrEqual(3);
    // What the life record's makeup-water section shows (GET /appliances/:id/makeup-water).
    const shown = await Promise.all(steam.map(async (a) => ({ id: a.id, ...(await makeupWaterService(ctx).get(demo.id, a.id)) })));
    for (const s of shown) {
      // Weekly from October 1, 2025 (the latest October 1 at least 13 weeks before December 3) to the morning of the seed.
      expect(s.entries[0].recordedOn >= '2025-10-01' && s.entries[0].recordedOn < '2025-10-08').toBe(true);
      expect(s.entries.at(-1)!.recordedOn).toBe('2026-12-03');
      expect(s.entries.length).toBe(62);
    }
    const codes = (s: (typeof shown)[number]) => s.analysis!.flags.map((f) => f.code);
    const leaking = shown.filter((s) => codes(s).includes('sharp_rise'));
    expect(leaking).toHaveLength(1);
    // "Look for a new leak": the latest 30 days at least twice the earlier periods' median, and more than 1 gal above it
    // (company defaults in shared/trade/makeup-water.ts, common practice).
    const rise = leaking[0].analysis!.flags.find((f) => f.code === 'sharp_rise')!;
    expect(rise.value).toBeGreaterThanOrEqual(rise.threshold!);
    expect(leaking[0].analysis!.latest30DayGallons!).toBeGreaterThanOrEqual(2 * leaking[0].analysis!.previous30DayMedianGallons!);
    const normal = shown.filter((s) => codes(s).length === 0);
    expect(normal.length).toBe(shown.length - 1);
    for (const s of normal) {
      // Water no more often than about once a month: no leak warning. common practice (trade-sources.md, "Makeup water")
      expect(s.analysis!.meanDaysBetweenFills!).toBeGreaterThanOrEqual(30);
      // A small rate: under a gallon a week (our demo's own choice, not a published limit).
      expect(s.analysis!.gallonsPerWeek!).toBeGreaterThan(0);
      expect(s.analysis!.gallonsPerWeek!).toBeLessThan(1);
    }
    // The demo homeowner's own boiler is a normal one.
    const homeowners = await ctx.db
      .select({ id: appliances.id })
      .from(appliances)
      .innerJoin(sites, eq(sites.id, appliances.siteId))
      .innerJoin(customers, eq(customers.id, sites.customerId))
      .where(and(eq(appliances.companyId, demo.id), eq(appliances.kind, 'steam_boiler'), eq(customers.email, DEMO_HOMEOWNER.email)));
    for (const h of homeowners) expect(leaking[0].id).not.toBe(h.id);
  });

  it('has enough worn-out parts of one type for a manager to adopt a learned service life', async () => {
    const [demo] = await ctx.db.select().from(companies).where(eq(companies.name, DEMO_COMPANY.name));
    const estimates = await serviceLifeService(ctx).estimates(demo.id);
    const adoptable = estimates.filter((e) => e.canAdopt);
    expect(adoptable.length).toBeGreaterThanOrEqual(1);
    expect(adoptable[0].events).toBeGreaterThanOrEqual(30);
    // Parts changed at every annual service are not counted as worn out.
    expect(estimates.find((e) => e.componentType === 'oil_filter')?.events ?? 0).toBe(0);
  });

  it('every demo visit is one the app would let a technician complete: steps marked, outcome set, readings taken, warnings told', async () => {
    const [demo] = await ctx.db.select().from(companies).where(eq(companies.name, DEMO_COMPANY.name));
    const rows = await ctx.db
      .select({ visit: visits, construction: appliances.construction })
      .from(visits)
      .innerJoin(appliances, eq(appliances.id, visits.applianceId))
      .where(eq(visits.companyId, demo.id));
    expect(rows.length).toBeGreaterThan(100);
    const refused = rows
      .map(({ visit: v, construction }) => {
        const results = v.results as { flags?: TradeFlag[]; lowWaterCutoff?: { passed: boolean } };
        const missing = completionRequirements({
          ...v,
          flags: results.flags ?? [],
          lowWaterCutoffFailed: results.lowWaterCutoff?.passed === false,
          appliance: { construction },
        });
        return { visit: `${v.type} ${v.visitedOn}`, missing: missing.map((m) => `${m.field}: ${m.message}`) };
      })
      .filter((r) => r.missing.length);
    expect(refused).toEqual([]);
    expect(rows.every(({ visit }) => visit.status === 'completed')).toBe(true);
    expect(rows.some(({ visit }) => visit.requiredReadings.includes('combustion'))).toBe(true);
  });
  it('queues the homeowners’ confirmations of the seeded future bookings once, each with its calendar invitation', async () => {
    const [demo] = await ctx.db.select().from(companies).where(eq(companies.name, DEMO_COMPANY.name));
    const ahead = await ctx.db
      .select({ id: bookings.id })
      .from(bookings)
      .where(and(eq(bookings.companyId, demo.id), inArray(bookings.status, ['booked', 'confirmed']), sql`${bookings.startsAt} >= ${SEEDED_AT.toISOString()}::timestamptz`));
    expect(ahead.length).toBeGreaterThan(10);
    const deps = { mail: ctx.mail, config: ctx.config };
    const mailIds = await queueDemoBookingConfirmations(ctx.db, deps, { now: SEEDED_AT });
    expect(mailIds.length).toBeGreaterThan(0);
    const notices = await ctx.db.select().from(bookingNotices).where(eq(bookingNotices.companyId, demo.id));
    expect(notices.map((n) => n.bookingId).sort()).toEqual(ahead.map((b) => b.id).sort());
    expect(new Set(notices.map((n) => n.kind))).toEqual(new Set(['booked']));
    // A restart finds every booking announced and queues nothing more.
    expect(await queueDemoBookingConfirmations(ctx.db, deps, { now: SEEDED_AT })).toEqual([]);
    expect(await ctx.db.select().from(bookingNotices).where(eq(bookingNotices.companyId, demo.id))).toHaveLength(notices.length);
    const [row] = await ctx.db.select().from(outgoingMail).where(eq(outgoingMail.id, mailIds[0]));
    expect(row).toMatchObject({ kind: 'booking_notice', companyId: demo.id, status: 'queued' });
    const mail = JSON.parse(open(ctx.config.BETTER_AUTH_SECRET, MAIL_SEAL_PURPOSE, row.sealed!)) as Mail;
    expect(mail.headers?.['X-Lifeplate-Company']).toBe(demo.id);
    const ics = Buffer.from(mail.attachments![0].content, 'base64').toString('utf8');
    expect(ics).toContain('METHOD:REQUEST');
    expect(ics).toContain('DTSTART;TZID=America/New_York:');
  });
});

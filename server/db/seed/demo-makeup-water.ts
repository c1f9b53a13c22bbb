import { and, asc, eq } from 'drizzle-orm';
import type { Tx } from '../client';
import { appliances, sites, timelineEvents } from '../schema/index';
import { insertMakeupWaterLog, type MakeupWaterLogEntry } from '../factories/water';
import { addDays, isoDateToDayNumber } from '../../../shared/trade/iso-date';
import type { DemoClock } from './demo-clock';

/** The meters are read first thing in the morning, company time. */
const READ_AT_HOUR = 8;
/** The heating season runs October 1 to May 31. from memory: NYC Housing Maintenance Code § 27-2029 ("heat season"). */
const SEASON_FIRST_MONTH = 10;
const SEASON_LAST_MONTH = 5;
/**
 * The log starts on the latest October 1 at least 13 weeks before the last reading, so it always holds the three full
 * 30-day periods the trend needs (the latest and more than minPreviousWindows = 2 earlier ones, shared/trade/makeup-water.ts).
 */
const MIN_LOG_DAYS = 91;
/**
 * A tight system's feeder moves the meter a gallon or a few every five weeks of firing: less often than "about once a
 * month", so no leak warning (trade-sources.md, "Makeup water": common practice; frequentFillIntervalDays = 30 in
 * shared/trade/makeup-water.ts). The amounts are our own invention.
 */
const NORMAL_FILL_EVERY_WEEKS = 5;
const NORMAL_FILL_GALLONS = [2, 3, 2, 1, 3];
/**
 * A new leak: over the last six weekly readings the meter climbs faster each week. The latest 30 days then hold several
 * times the median of the earlier 30-day periods, past the sharp-rise threshold (max(2 × median, median + 1 gal),
 * the company defaults in shared/trade/makeup-water.ts), and fills come weekly, more often than about once a month.
 */
const LEAK_WEEKLY_GALLONS = [3, 5, 7, 9, 11, 13];

const inSeason = (date: string) => {
  const month = Number(date.slice(5, 7));
  return month >= SEASON_FIRST_MONTH || month <= SEASON_LAST_MONTH;
};

/** The latest October 1 at least MIN_LOG_DAYS before `lastRead`. */
export function seasonStart(lastRead: string): string {
  let year = Number(lastRead.slice(0, 4));
  const days = (from: string) => isoDateToDayNumber('lastRead', lastRead) - isoDateToDayNumber('from', from);
  while (days(`${year}-10-01`) < MIN_LOG_DAYS) year -= 1;
  return `${year}-10-01`;
}

/**
 * One steam boiler's feeder-meter log: a reading every week from the start of the heating season to `lastRead`.
 * Out of season the boiler is idle and the meter stands still; `variant` staggers the boilers' fill weeks and sizes.
 */
export function planMakeupWaterLog(input: { lastRead: string; leak: boolean; variant: number; startGallons: number }): MakeupWaterLogEntry[] {
  const dates: string[] = [];
  const start = seasonStart(input.lastRead);
  for (let d = input.lastRead; d >= start; d = addDays(d, -7)) dates.unshift(d);
  const leakFrom = dates.length - LEAK_WEEKLY_GALLONS.length;
  let meter = input.startGallons;
  let firingWeeks = 0;
  return dates.map((date, i) => {
    if (i > 0 && input.leak && i >= leakFrom) meter += LEAK_WEEKLY_GALLONS[i - leakFrom];
    else if (i > 0 && inSeason(date)) {
      firingWeeks += 1;
      if ((firingWeeks + input.variant) % NORMAL_FILL_EVERY_WEEKS === 0) meter += NORMAL_FILL_GALLONS[(firingWeeks + input.variant) % NORMAL_FILL_GALLONS.length];
    }
    return { recordedOn: date, kind: 'meter_reading' as const, gallons: meter, note: null };
  });
}

/**
 * Invented feeder-meter logs for every in-service demo steam boiler through the heating season: weekly readings, most
 * with a small normal rate, one (not the demo homeowner's) with a rising trend that trips the leak flags. The last
 * reading is this morning's, or yesterday's when the seed runs before the morning reading: nothing after `now`.
 */
export async function seedDemoMakeupWater(tx: Tx, input: { companyId: string; homeownerCustomerId: string; clock: DemoClock }) {
  const steam = await tx
    .select({ id: appliances.id, customerId: sites.customerId })
    .from(appliances)
    .innerJoin(sites, eq(sites.id, appliances.siteId))
    .where(and(eq(appliances.companyId, input.companyId), eq(appliances.kind, 'steam_boiler'), eq(appliances.status, 'in_service')))
    .orderBy(asc(appliances.createdAt), asc(appliances.id));
  const leaking = steam.find((a) => a.customerId !== input.homeownerCustomerId);
  const lastRead = input.clock.lastDayAt(READ_AT_HOUR);
  for (const [variant, boiler] of steam.entries()) {
    const log = planMakeupWaterLog({ lastRead, leak: boiler === leaking, variant, startGallons: 400 + 137 * variant });
    const inserted = await insertMakeupWaterLog(tx, { companyId: input.companyId, applianceId: boiler.id, entries: log });
    // The record's history tells the first reading and each one that shows water added; a week the meter stood
    // still is in the log (and its rate) without a line of its own, so a season of readings does not bury the visits.
    const told = inserted.filter((r, i) => i === 0 || r.gallons !== inserted[i - 1].gallons);
    await tx.insert(timelineEvents).values(
      told.map((r) => ({
        companyId: r.companyId,
        applianceId: r.applianceId,
        occurredAt: input.clock.at(r.recordedOn, READ_AT_HOUR),
        kind: 'makeup_water' as const,
        summary: `Makeup-water meter read ${r.gallons!.toLocaleString('en-US')} gal`,
        refId: r.id,
        data: { makeupWater: { kind: r.kind, gallons: r.gallons } },
      })),
    );
  }
}

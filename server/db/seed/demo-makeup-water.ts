import { and, asc, eq } from 'drizzle-orm';
import type { Tx } from '../client';
import { appliances, makeupWaterEntries, sites, timelineEvents } from '../schema/index';
import type { DemoClock } from './demo-clock';

const day = (iso: string, plus: number) => new Date(Date.parse(`${iso}T00:00:00Z`) + plus * 86_400_000).toISOString().slice(0, 10);
/** The meters are read first thing in the morning, company time. */
const READ_AT_HOUR = 8;

/**
 * Invented feeder-meter logs for two steam boilers over the past heating season: one steady (a few gallons a month),
 * one whose use jumps in the last month, as a new leak would show. They make the makeup-water flags visible in the demo.
 * The last reading is this morning's, or yesterday's when the seed runs before the morning reading.
 */
export async function seedDemoMakeupWater(tx: Tx, input: { companyId: string; homeownerCustomerId: string; clock: DemoClock }) {
  const steam = await tx
    .select({ id: appliances.id, customerId: sites.customerId })
    .from(appliances)
    .innerJoin(sites, eq(sites.id, appliances.siteId))
    .where(and(eq(appliances.companyId, input.companyId), eq(appliances.kind, 'steam_boiler'), eq(appliances.status, 'in_service')))
    .orderBy(asc(appliances.createdAt), asc(appliances.id));
  const steady = steam.find((a) => a.customerId === input.homeownerCustomerId);
  const leaking = steam.find((a) => a.customerId !== input.homeownerCustomerId);
  const start = day(input.clock.lastDayAt(READ_AT_HOUR), -150);
  const rows: (typeof makeupWaterEntries.$inferInsert)[] = [];
  if (steady) {
    let meter = 412;
    for (let d = 0; d <= 150; d += 30) rows.push({ companyId: input.companyId, applianceId: steady.id, recordedOn: day(start, d), kind: 'meter_reading', gallons: (meter += d ? 3 : 0), note: null });
  }
  if (leaking) {
    let meter = 1280;
    for (let w = 0; w * 7 <= 150; w++) {
      // Steady at first, then a sharp rise over the last month, as a new leak would show.
      meter += w === 0 ? 0 : w < 18 ? 2 + Math.floor(w / 6) : 12;
      rows.push({ companyId: input.companyId, applianceId: leaking.id, recordedOn: day(start, w * 7), kind: 'meter_reading', gallons: meter, note: null });
    }
  }
  if (!rows.length) return;
  const inserted = await tx.insert(makeupWaterEntries).values(rows).returning();
  await tx.insert(timelineEvents).values(
    inserted.map((r) => ({
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

import { and, count, eq, inArray, isNull, sql } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { appliances, companies, components, customers, partSwaps, sites, timelineEvents, visits } from '../../server/db/schema/index';
import { seedDemo } from '../../server/db/seed/seed-demo';
import { DEMO_COMPANY, OTHER_COMPANY } from '../../server/db/seed/demo-accounts';
import { testApp } from '../support/context';
import { completionRequirements } from '../../shared/visits/completion-requirements';
import type { TradeFlag } from '../../shared/trade/trade-flag';

const { ctx } = testApp();
afterAll(() => ctx.pool.end());

describe('demo seed', () => {
  it('seeds once; a second run adds nothing', async () => {
    await seedDemo(ctx.db);
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
    const future = await ctx.db.select({ n: count() }).from(timelineEvents).where(and(eq(timelineEvents.companyId, demo.id), sql`${timelineEvents.occurredAt} > now()`));
    expect(future[0].n).toBe(0);
    const removed = demoAppliances.filter((a) => a.status === 'removed');
    expect(removed).toHaveLength(1);
    expect(demoAppliances.some((a) => a.id === removed[0].replacedById)).toBe(true);
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
});

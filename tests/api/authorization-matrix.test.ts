import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { routeTable } from '../../server/lib/route';
import { ROUTE_CASES } from '../support/authorization/cases';
import { callersFor } from '../support/authorization/expected';
import { walkCell, type CellResult, type Walkers } from '../support/authorization/walk';
import { buildWorld } from '../support/authorization/world';
import { testApp } from '../support/context';

// Every route × every caller, the expected answer derived from the route's access and the role table
// (shared/policy.ts), against the real app and real records of two companies.
const { app, ctx } = testApp();
let w: Walkers;

beforeAll(async () => {
  const [a, b] = [await buildWorld(ctx, app), await buildWorld(ctx, app)];
  w = { ctx, app, a, b };
}, 60_000);
afterAll(async () => {
  ctx.storage.destroy();
  await ctx.pool.end();
});

describe('authorization matrix', () => {
  it('has an expectation for every route and none for a route that is gone', () => {
    const routes = [...routeTable.keys()];
    expect(routes.length).toBeGreaterThan(50);
    expect(routes.filter((r) => !(r in ROUTE_CASES))).toEqual([]);
    expect(Object.keys(ROUTE_CASES).filter((r) => !routeTable.has(r))).toEqual([]);
  });

  it('answers every cell as the role table and the tenant boundary say', async () => {
    const results: CellResult[] = [];
    for (const route of [...routeTable.values()].sort((x, y) => `${x.path} ${x.method}`.localeCompare(`${y.path} ${y.method}`))) {
      const spec = ROUTE_CASES[`${route.method} ${route.path}`];
      if (!spec) {
        results.push({ route: `${route.method} ${route.path}`, caller: 'signedOut', expected: 0, got: 0, problem: 'no expectation for this route' });
        continue;
      }
      for (const caller of callersFor(route)) results.push(await walkCell(w, route, spec, caller));
    }
    const wrong = results.filter((r) => r.problem);
    const cross = results.filter((r) => r.caller === 'otherManager' || r.caller === 'otherHomeowner');
    const counts = new Map<number, number>();
    for (const r of cross) counts.set(r.got, (counts.get(r.got) ?? 0) + 1);
    const byStatus = [...counts].sort(([x], [y]) => x - y).map(([status, n]) => `${status} ×${n}`);
    const leaks = results.filter((r) => r.problem?.includes("first company's values")).length;
    console.log(
      `[authorization matrix] ${routeTable.size} routes, ${results.length} cells tested, ${results.length - wrong.length} as expected; ` +
        `${cross.length} cells of another company's callers (${byStatus.join(', ')}), ${leaks} showing the first company's data`,
    );
    expect(wrong.map((r) => `${r.route} as ${r.caller}: expected ${r.expected}, ${r.problem}`)).toEqual([]);
  }, 300_000);
});

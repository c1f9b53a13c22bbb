import http from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signInCrew } from '../../bench/server/crew';
import { auditCrew, runCrew } from '../../bench/server/technicians';
import { createApp } from '../../server/app';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { DEFAULT_TEST_PASSWORD, insertMember } from '../../server/db/factories/users';
import { testContext } from '../support/context';
import { freePort } from '../support/global-setup';
import { createTenant } from '../support/tenant';

// The bench's concurrent-technicians scenario, small, for correctness only: counts are asserted, never speed.
const TECHNICIANS = 20;
const SECONDS = 10;
const SAVES_PER_VISIT = 3;

let ctx: ReturnType<typeof testContext>;
let server: http.Server;
let baseUrl: string;

beforeAll(async () => {
  const port = await freePort();
  baseUrl = `http://127.0.0.1:${port}`;
  ctx = testContext({ BASE_URL: baseUrl });
  server = http.createServer(createApp(ctx));
  await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  ctx.storage.destroy();
  await ctx.pool.end();
});

describe('technicians working at once', () => {
  it('stores every visit each answer named once, completed with every save, and answers no error', async () => {
    const t = await createTenant(ctx.db);
    const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id });
    // Fewer appliances than technicians, so some work on the same appliance at the same time.
    const applianceIds: string[] = [];
    for (let i = 0; i < 12; i++) applianceIds.push((await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: i % 2 ? 'hot_water_boiler' : 'steam_boiler' })).id);
    const people = [];
    for (let i = 0; i < TECHNICIANS; i++) {
      const { user } = await insertMember(ctx.db, { companyId: t.company.id, role: 'technician' });
      people.push({ userId: user.id, email: user.email });
    }
    const crew = await signInCrew(baseUrl, people, DEFAULT_TEST_PASSWORD);

    const run = await runCrew({ baseUrl, crew, applianceIds, seconds: SECONDS, savesPerVisit: SAVES_PER_VISIT, thinkMs: [0, 30] });
    const audit = await auditCrew(ctx.pool, run, people.map((p) => p.userId), SAVES_PER_VISIT);
    console.log(
      `[concurrent technicians] ${TECHNICIANS} technicians, ${SECONDS} s: ${run.started.length} visits started, ${run.saves} draft saves, ` +
        `${run.completed.length} completed, ${run.errors.length} errors; ${audit.rows} rows stored, lost ${audit.lost}, duplicated ${audit.duplicated}`,
    );

    expect(run.errors).toEqual([]);
    // Every technician starts a visit at once and finishes the one under way when the time is up.
    expect(run.started.length).toBeGreaterThanOrEqual(TECHNICIANS);
    expect(run.completed).toHaveLength(run.started.length);
    expect(run.saves).toBe(run.started.length * SAVES_PER_VISIT);
    expect(audit).toEqual({ rows: run.started.length, completedRows: run.started.length, lost: 0, duplicated: 0, unexpected: 0, wrongRevision: 0 });
  }, 90_000);
});

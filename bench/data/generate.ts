import { sql } from 'drizzle-orm';
import { drizzle } from 'drizzle-orm/node-postgres';
import { hashPassword } from 'better-auth/crypto';
import pg from 'pg';
import * as schema from '../../server/db/schema/index';
import type { Db } from '../../server/db/client';
import { runMigrations } from '../../server/db/migrate';
import { fakerFor } from '../../server/db/factories/faker';
import { insertCompany } from '../../server/db/factories/companies';
import { INVENTED_COMPANY_NAMES } from '../../server/db/factories/invented-names';
import { recomputeDueStatement } from '../../server/modules/due/due-recompute.sql';
import { todayInTimeZone } from '../../shared/dates';
import { databaseUrlOn, recreateDatabase } from '../lib/bench-db';
import { buildNameLists } from './name-lists';
import { buildPrototypes } from './prototypes';
import { prototypeSteps, recordSteps } from './load-records';
import { runStep } from './run-steps';
import { bookingSteps } from './load-bookings';
import { createSeededFunctions, seededUuid } from './seeded-sql';
import { dropSecondaryIndexes, LOADED_TABLES, recreateIndexes } from './indexes';
import { insertBenchUsers, BENCH_PASSWORD, type BenchCompanyUsers } from './bench-users';
import { loadTags } from './load-tags';
import { writeBenchMeta, type BenchMeta } from './bench-meta';

export const SMALL_COMPANIES = 50;
const TIME_ZONE = 'America/New_York';

export type GenerateOptions = {
  /** Any database URL on the target server; the bench database is made beside it. */
  serverUrl: string;
  database: string;
  appliances: number;
  seed: number;
  /** The day the 20 years of history end (default: today in the companies' time zone). */
  today?: string;
  log?: (line: string) => void;
};

type CompanyPlan = { k: number; id: string; name: string; appliances: number; sites: number; customers: number };

function planCompanies(seed: number, appliances: number): CompanyPlan[] {
  const small = Math.max(10, Math.round(appliances / 1000));
  return Array.from({ length: SMALL_COMPANIES + 1 }, (_, k) => {
    const n = k === 0 ? appliances : small;
    const sites = Math.max(1, Math.round(n * 0.8));
    const base = INVENTED_COMPANY_NAMES[k % INVENTED_COMPANY_NAMES.length];
    return { k, id: seededUuid(seed, `co:${k}`), name: k === 0 ? base : `${base}, branch ${k}`, appliances: n, sites, customers: Math.max(1, Math.round(sites * 0.9)) };
  });
}

export async function generateBenchData(opts: GenerateOptions): Promise<BenchMeta> {
  const log = opts.log ?? (() => {});
  const started = Date.now();
  const lap = (what: string, since: number) => log(`  ${what} (${((Date.now() - since) / 1000).toFixed(1)} s)`);
  const today = opts.today ?? todayInTimeZone(TIME_ZONE);
  const databaseUrl = databaseUrlOn(opts.serverUrl, opts.database);

  log(`Creating ${opts.database} and running migrations…`);
  await recreateDatabase(opts.serverUrl, opts.database);
  await runMigrations(databaseUrl);

  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const db = drizzle(client, { schema, casing: 'snake_case' }) as unknown as Db;
    // Rows are consistent by construction, so the load skips per-row foreign-key triggers; commits need not wait for disk.
    await client.query(`set session_replication_role = replica; set synchronous_commit = off; set maintenance_work_mem = '256MB'; set work_mem = '64MB'`);
    await createSeededFunctions(client, opts.seed);
    const f = fakerFor(opts.seed);
    const names = buildNameLists(f);
    const protos = buildPrototypes(f, today);

    const plans = planCompanies(opts.seed, opts.appliances);
    let t = Date.now();
    for (const c of plans) await insertCompany(db, { id: c.id, name: c.name, phone: `555-01${String(10 + (c.k % 90)).padStart(2, '0')}`, timeZone: TIME_ZONE });
    const users: BenchCompanyUsers[] = await insertBenchUsers(db, f, opts.seed, plans, await hashPassword(BENCH_PASSWORD));
    lap(`${plans.length} companies with catalog, checklists, due rules and members`, t);

    await client.query(
      `create temp table bench_co as select * from jsonb_to_recordset($1::jsonb) as t(k int, id uuid, n_app int, n_site int, n_cust int, techs uuid[])`,
      [JSON.stringify(plans.map((c, i) => ({ k: c.k, id: c.id, n_app: c.appliances, n_site: c.sites, n_cust: c.customers, techs: users[i].technicianIds })))],
    );

    t = Date.now();
    const indexDefs = await dropSecondaryIndexes(client);
    lap(`dropped ${indexDefs.length} secondary indexes for the load`, t);

    for (const step of [...prototypeSteps(protos), ...recordSteps({ today, names }), ...bookingSteps({ today, timeZone: TIME_ZONE })]) {
      t = Date.now();
      await runStep(client, step);
      lap(step.name, t);
    }
    t = Date.now();
    const tagCount = await loadTags(client, f, plans);
    lap(`${tagCount} tags`, t);

    t = Date.now();
    for (const c of plans) await db.execute(recomputeDueStatement(sql`c.company_id = ${c.id}`, today));
    lap('due dates (the set-based recompute the app runs)', t);

    t = Date.now();
    await recreateIndexes(client, indexDefs);
    lap(`recreated ${indexDefs.length} indexes`, t);

    await client.query('set session_replication_role = origin');
    t = Date.now();
    // Only the loaded tables: vacuuming the catalogs too would dominate a small load.
    await client.query(`vacuum (analyze) ${[...LOADED_TABLES, 'tag_batches', 'companies', 'users', 'memberships', 'sessions', 'accounts'].join(', ')}`);
    lap('vacuum analyze', t);

    const meta = await writeBenchMeta(client, { seed: opts.seed, appliances: opts.appliances, today, companyId: plans[0].id, members: users[0].signIn, password: BENCH_PASSWORD });
    log(`Done in ${((Date.now() - started) / 1000).toFixed(0)} s: ${Object.entries(meta.counts).map(([k, v]) => `${v} ${k}`).join(', ')}.`);
    return meta;
  } finally {
    await client.end();
  }
}

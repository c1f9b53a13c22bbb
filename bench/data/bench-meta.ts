import type pg from 'pg';
import type { MemberRole } from '../../shared/schemas/roles';

/** What `npm run bench` needs to know about a generated database, kept in the database itself. */
export type BenchMeta = {
  seed: number;
  appliances: number;
  today: string;
  /** The large company, whose members sign in. */
  companyId: string;
  members: { email: string; role: MemberRole }[];
  password: string;
  counts: Record<string, number>;
};

const COUNTED = ['companies', 'customers', 'sites', 'appliances', 'components', 'visits', 'part_swaps', 'photos', 'tags', 'timeline_events', 'bookings'];

export async function writeBenchMeta(client: pg.ClientBase, meta: Omit<BenchMeta, 'counts'>): Promise<BenchMeta> {
  const counts: Record<string, number> = {};
  for (const table of COUNTED) counts[table] = Number((await client.query(`select count(*)::bigint as n from ${table}`)).rows[0].n);
  const full = { ...meta, counts };
  await client.query('create table bench_meta (id int primary key default 1, meta jsonb not null)');
  await client.query('insert into bench_meta (meta) values ($1)', [JSON.stringify(full)]);
  return full;
}

export async function readBenchMeta(client: pg.ClientBase | pg.Pool): Promise<BenchMeta> {
  try {
    return (await client.query<{ meta: BenchMeta }>('select meta from bench_meta where id = 1')).rows[0].meta;
  } catch {
    throw new Error('This database has no bench_meta: generate it first with `npm run bench:data`.');
  }
}

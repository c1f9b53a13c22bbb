import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as schema from './schema/index';

export type Db = NodePgDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type DbOrTx = Db | Tx;

export function createDb(databaseUrl: string, options: { max?: number } = {}) {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: options.max ?? 10, connectionTimeoutMillis: 3000 });
  // An idle client erroring (e.g. the server restarting) must not crash the process; the next query reports it.
  pool.on('error', () => {});
  const db = drizzle(pool, { schema, casing: 'snake_case' });
  return { db, pool };
}

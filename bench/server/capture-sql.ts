import { drizzle } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as schema from '../../server/db/schema/index';
import type { Db } from '../../server/db/client';

export type CapturedQuery = { text: string; values: unknown[] };
type QueryConfig = { text: string; values?: unknown[] };

/**
 * A Drizzle handle whose every query is also recorded, so the bench replays exactly the SQL a repository
 * function sends (pgbench, EXPLAIN) instead of a hand-written copy that could drift.
 */
export function capturingDb(databaseUrl: string) {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 1 });
  const captured: CapturedQuery[] = [];
  const original = pool.query.bind(pool) as (q: QueryConfig | string, v?: unknown[]) => Promise<pg.QueryResult>;
  const recording = (q: QueryConfig | string, values?: unknown[]) => {
    if (typeof q === 'string') captured.push({ text: q, values: values ?? [] });
    else captured.push({ text: q.text, values: q.values ?? values ?? [] });
    return original(q, values);
  };
  Object.assign(pool, { query: recording });
  const db = drizzle(pool, { schema, casing: 'snake_case' }) as unknown as Db;
  return { db, captured, close: () => pool.end() };
}

/** A query's text with its $n parameters written in as literals (or as the given SQL for some of them). */
export function inlineParams(q: CapturedQuery, replace: (value: unknown, index: number) => string | undefined = () => undefined) {
  return q.text.replace(/\$(\d+)/g, (_m, n: string) => {
    const i = Number(n) - 1;
    const value = q.values[i];
    const custom = replace(value, i);
    if (custom !== undefined) return custom;
    if (typeof value === 'number') return String(value);
    if (value === null || value === undefined) return 'null';
    if (value instanceof Date) return `'${value.toISOString()}'`;
    return `'${String(value).replace(/'/g, "''")}'`;
  });
}

import { sql } from 'drizzle-orm';
import type { Db } from '../../server/db/client';

/**
 * Counts every row inserted, updated or deleted in any table of the public schema, with a row trigger on each
 * that bumps one counter in a schema of its own. Only for a database of the test's own (tests/support/own-database):
 * the counter moves only when a write commits, so a refused request must leave it where it was.
 */
export async function installWriteCounter(db: Db): Promise<() => Promise<number>> {
  await db.execute(sql`create schema write_counter`);
  await db.execute(sql`create table write_counter.rows (n bigint not null)`);
  await db.execute(sql`insert into write_counter.rows values (0)`);
  await db.execute(
    sql.raw(`create function write_counter.bump() returns trigger language plpgsql as $$
      begin update write_counter.rows set n = n + 1; return null; end $$`),
  );
  const tables = await db.execute<{ name: string }>(
    sql`select table_name as name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE'`,
  );
  if (!tables.rows.length) throw new Error('No tables in the public schema');
  for (const { name } of tables.rows) {
    await db.execute(
      sql.raw(`create trigger write_counter after insert or update or delete on public."${name.replace(/"/g, '""')}"
        for each row execute function write_counter.bump()`),
    );
  }
  return async () => Number((await db.execute<{ n: string }>(sql`select n from write_counter.rows`)).rows[0].n);
}

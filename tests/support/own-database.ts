import crypto from 'node:crypto';
import pg from 'pg';
import { inject } from 'vitest';
import { runMigrations } from '../../server/db/migrate';

/**
 * A database of its own in the test cluster, migrated, for a test that must see every row written: the shared test
 * database is written by the other test files at the same time.
 */
export async function createOwnDatabase(prefix: string) {
  const shared = new URL(inject('databaseUrl'));
  const name = `${prefix}_${crypto.randomBytes(4).toString('hex')}`;
  const admin = new URL(shared);
  admin.pathname = '/postgres';
  const run = async (sql: string) => {
    const client = new pg.Client({ connectionString: admin.toString() });
    await client.connect();
    try {
      await client.query(sql);
    } finally {
      await client.end();
    }
  };
  await run(`create database "${name}"`);
  const url = new URL(shared);
  url.pathname = `/${name}`;
  await runMigrations(url.toString());
  return { url: url.toString(), drop: () => run(`drop database if exists "${name}" with (force)`) };
}

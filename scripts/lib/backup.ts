import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';

export const DATABASE_NAME = /^[a-z_][a-z0-9_]{0,62}$/;

const stamp = (now: Date) => now.toISOString().replace(/\.\d{3}Z$/, 'Z').replace(/[-:]/g, '');
const withDatabase = (serverUrl: string, database: string) => {
  const url = new URL(serverUrl);
  url.pathname = `/${database}`;
  return url.toString();
};
export const databaseOf = (url: string) => decodeURIComponent(new URL(url).pathname.slice(1));

/**
 * pg_dump in its custom format (compressed, restorable table by table with pg_restore) into `outDir`, named
 * `<database>-<UTC timestamp>.dump`. The dump is one consistent snapshot even while the app writes.
 */
export function backupDatabase(opts: { bin: string; databaseUrl: string; outDir: string; now?: Date }): string {
  fs.mkdirSync(opts.outDir, { recursive: true });
  const file = path.join(opts.outDir, `${databaseOf(opts.databaseUrl)}-${stamp(opts.now ?? new Date())}.dump`);
  execFileSync(path.join(opts.bin, 'pg_dump'), ['--format=custom', '--file', file, '--dbname', opts.databaseUrl], { stdio: ['ignore', 'ignore', 'pipe'] });
  return file;
}

/** `lifeplate_restored_20261202_150405`: a new name each time, in UTC. */
export const restoredDatabaseName = (now = new Date()) => `lifeplate_restored_${stamp(now).replace('T', '_').replace('Z', '')}`;

/**
 * Restores a custom-format dump into a new database on the same server (never over an existing one) and returns
 * its URL. A failed restore drops the half-made database again.
 */
export async function restoreDatabase(opts: { bin: string; serverUrl: string; file: string; database: string }): Promise<string> {
  if (!DATABASE_NAME.test(opts.database)) throw new Error(`'${opts.database}' is not a database name (lower case, digits, _; at most 63).`);
  if (!fs.existsSync(opts.file)) throw new Error(`No file ${opts.file}`);
  // Reads the archive's table of contents first, so a file that is not a dump fails before any database is made.
  execFileSync(path.join(opts.bin, 'pg_restore'), ['--list', opts.file], { stdio: ['ignore', 'ignore', 'pipe'] });
  const admin = new pg.Client({ connectionString: withDatabase(opts.serverUrl, 'postgres') });
  await admin.connect();
  try {
    const exists = await admin.query('select 1 from pg_database where datname = $1', [opts.database]);
    if (exists.rowCount) throw new Error(`A database ${opts.database} already exists; restore into a new name.`);
    await admin.query(`create database "${opts.database}"`);
    const url = withDatabase(opts.serverUrl, opts.database);
    try {
      execFileSync(path.join(opts.bin, 'pg_restore'), ['--no-owner', '--no-privileges', '--exit-on-error', '--single-transaction', '--dbname', url, opts.file], {
        stdio: ['ignore', 'ignore', 'pipe'],
      });
    } catch (err) {
      await admin.query(`drop database if exists "${opts.database}" with (force)`);
      throw err;
    }
    return url;
  } finally {
    await admin.end();
  }
}

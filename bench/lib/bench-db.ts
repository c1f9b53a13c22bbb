import pg from 'pg';
import { clusterUrl, ensureDatabase } from '../../scripts/lib/postgres';
import { clusterIn, ensureClusterRunning, localDataRoot, localPgPort } from '../../scripts/lib/local-cluster';

/** Bench databases are dropped and rebuilt; refusing other names keeps `--db lifeplate` from wiping the demo. */
export const BENCH_DB_PREFIX = 'lifeplate_bench';

export function benchDbName(appliances: number) {
  return appliances % 1000 === 0 ? `${BENCH_DB_PREFIX}_${appliances / 1000}k` : `${BENCH_DB_PREFIX}_${appliances}`;
}

/** The same server, another database. */
export function databaseUrlOn(serverUrl: string, database: string) {
  const url = new URL(serverUrl);
  url.pathname = `/${database}`;
  return url.toString();
}

export function databaseNameOf(url: string) {
  return decodeURIComponent(new URL(url).pathname.slice(1));
}

export function assertBenchDbName(database: string) {
  if (!database.startsWith(BENCH_DB_PREFIX) || !/^[a-z0-9_]+$/.test(database)) {
    throw new Error(`Bench databases are named ${BENCH_DB_PREFIX}…(lower case, digits, _); refusing '${database}'.`);
  }
}

/**
 * The local cluster `npm start` uses (started here if it is not running). `stop` stops it again only if we
 * started it. LIFEPLATE_BENCH_SERVER_URL points at another server instead.
 */
export async function localBenchServer(log: (line: string) => void) {
  if (process.env.LIFEPLATE_BENCH_SERVER_URL) return { serverUrl: process.env.LIFEPLATE_BENCH_SERVER_URL, stop: () => {} };
  const { dir } = localDataRoot();
  const cluster = clusterIn(dir, localPgPort());
  const running = ensureClusterRunning(cluster);
  if (running.created) log(`Created a PostgreSQL cluster in ${cluster.dataDir}`);
  if (running.started) log(`Started PostgreSQL on 127.0.0.1:${cluster.port} (data in ${cluster.dataDir}); it stops when this command ends.`);
  await ensureDatabase(cluster.port, 'postgres');
  return { serverUrl: clusterUrl(cluster.port, 'postgres'), stop: running.stop };
}

export async function recreateDatabase(serverUrl: string, database: string) {
  assertBenchDbName(database);
  const client = new pg.Client({ connectionString: databaseUrlOn(serverUrl, 'postgres') });
  await client.connect();
  try {
    await client.query(`drop database if exists "${database}" with (force)`);
    await client.query(`create database "${database}"`);
  } finally {
    await client.end();
  }
}

export async function databaseExists(serverUrl: string, database: string) {
  const client = new pg.Client({ connectionString: databaseUrlOn(serverUrl, 'postgres') });
  await client.connect();
  try {
    return Boolean((await client.query('select 1 from pg_database where datname = $1', [database])).rowCount);
  } finally {
    await client.end();
  }
}

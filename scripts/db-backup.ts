/**
 * `npm run db:backup [-- --db <name> --out <dir>]`: pg_dump (custom format) of the app's database on the local
 * cluster into <data folder>/backups/<database>-<UTC timestamp>.dump. With DATABASE_URL set, that database instead.
 */
import fs from 'node:fs';
import path from 'node:path';
import { parseArgs } from '../bench/lib/args';
import { backupDatabase, databaseOf } from './lib/backup';
import { clusterIn, ensureClusterRunning, localDataRoot, localPgPort } from './lib/local-cluster';
import { clusterUrl, findPgBin } from './lib/postgres';
import { appDatabaseName } from './lib/settings';

function main() {
  const args = parseArgs(process.argv.slice(2), { db: 'string', out: 'string' });
  const { dir: dataRoot } = localDataRoot();
  const outDir = typeof args.out === 'string' ? path.resolve(args.out) : path.join(dataRoot, 'backups');
  let stop = () => {};
  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    const cluster = clusterIn(dataRoot, localPgPort());
    ({ stop } = ensureClusterRunning(cluster));
    databaseUrl = clusterUrl(cluster.port, typeof args.db === 'string' ? args.db : appDatabaseName(dataRoot));
  }
  try {
    const file = backupDatabase({ bin: findPgBin(), databaseUrl, outDir });
    const mb = (fs.statSync(file).size / 2 ** 20).toFixed(1);
    console.log(`Backed up ${databaseOf(databaseUrl)} to ${file} (${mb} MB).`);
    console.log('Copy it off this machine (another disk or a storage service): a backup beside the database is lost with it.');
  } finally {
    stop();
  }
}

try {
  main();
} catch (err) {
  console.error(err instanceof Error ? ((err as { stderr?: Buffer }).stderr?.toString() || err.message) : err);
  process.exit(1);
}

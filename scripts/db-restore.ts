/**
 * `npm run db:restore -- <file> [--db <name>] [--use]`: restores a dump made by db:backup into a NEW database on
 * the local cluster (default lifeplate_restored_<UTC timestamp>), prints its row counts and the URL to use.
 * `--use` also makes it the database `npm start` runs on (the data folder's settings.json); the old one is kept.
 */
import { parseArgs } from '../bench/lib/args';
import { restoreDatabase, restoredDatabaseName } from './lib/backup';
import { tableCounts } from './lib/db-contents';
import { clusterIn, ensureClusterRunning, localDataRoot, localPgPort } from './lib/local-cluster';
import { clusterUrl, findPgBin } from './lib/postgres';
import { appDatabaseName, writeSettings } from './lib/settings';

async function main() {
  const argv = process.argv.slice(2);
  const positional = argv.filter((a, i) => !a.startsWith('--') && argv[i - 1] !== '--db');
  if (positional.length !== 1) throw new Error('Usage: npm run db:restore -- <file.dump> [--db <name>] [--use]');
  const [file] = positional;
  const args = parseArgs(argv.filter((a) => a !== file), { db: 'string', use: 'boolean' });
  const { dir: dataRoot } = localDataRoot();
  const cluster = clusterIn(dataRoot, localPgPort());
  const { stop } = ensureClusterRunning(cluster);
  try {
    const database = typeof args.db === 'string' ? args.db : restoredDatabaseName();
    const url = await restoreDatabase({ bin: findPgBin(), serverUrl: clusterUrl(cluster.port, 'postgres'), file, database });
    const counts = await tableCounts(url);
    const main = ['public.companies', 'public.customers', 'public.appliances', 'public.visits', 'public.timeline_events', 'public.photos'];
    console.log(`Restored ${file} into ${database}: ${Object.keys(counts).length} tables, ${Object.values(counts).reduce((a, b) => a + b, 0)} rows`);
    console.log(`  ${main.filter((t) => t in counts).map((t) => `${t.slice(7)} ${counts[t]}`).join(', ')}`);
    if (args.use) {
      const before = appDatabaseName(dataRoot);
      writeSettings(dataRoot, { database });
      console.log(`npm start now uses ${database} (it used ${before}, which is kept). Restart the app if it is running.`);
    } else {
      console.log(`Its URL: ${url}\nTo run the app on it, add --use (npm start then uses ${database}; the current database is kept).`);
    }
  } finally {
    stop();
  }
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? ((err as { stderr?: Buffer }).stderr?.toString() || err.message) : err);
  process.exit(1);
});

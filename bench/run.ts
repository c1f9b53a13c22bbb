/**
 * `npm run bench [-- --db lifeplate_bench_100k --growth-db lifeplate_bench_10k --quick --no-client --crew 200
 * --crew-seconds 60 --no-crew --crew-only --import-only --bookings-only --service-life-only]`: boots the app on a bench database (see `npm run bench:data`), measures the
 * figures in docs/performance.md and docs/reliability.md, prints a table and writes bench/results/<date>.json.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs, positiveInt } from './lib/args';
import { benchDbName, databaseExists, databaseUrlOn, localBenchServer } from './lib/bench-db';
import { runBench } from './server/run-bench';
import { runMigrations } from '../server/db/migrate';

const HERE = path.dirname(fileURLToPath(import.meta.url));

async function main() {
  const args = parseArgs(process.argv.slice(2), {
    db: 'string',
    'growth-db': 'string',
    quick: 'boolean',
    'no-client': 'boolean',
    out: 'string',
    crew: 'string',
    'crew-seconds': 'string',
    'no-crew': 'boolean',
    'crew-only': 'boolean',
    'import-only': 'boolean',
    'bookings-only': 'boolean',
    'service-life-only': 'boolean',
  });
  const log = (line: string) => console.log(`[bench] ${line}`);
  const database = typeof args.db === 'string' ? args.db : benchDbName(100_000);
  const growthName = typeof args['growth-db'] === 'string' ? args['growth-db'] : benchDbName(10_000);
  const server = await localBenchServer(log);
  try {
    if (!(await databaseExists(server.serverUrl, database))) throw new Error(`No database ${database}: run \`npm run bench:data\` first.`);
    const growth = growthName !== database && (await databaseExists(server.serverUrl, growthName)) ? databaseUrlOn(server.serverUrl, growthName) : null;
    if (!growth) log(`No ${growthName}: the growth figures are skipped (npm run bench:data -- --appliances 10000).`);
    // A data set made before a later migration (a new index, say) is brought up to date, as npm start would do.
    for (const url of [databaseUrlOn(server.serverUrl, database), growth].filter((u): u is string => Boolean(u))) await runMigrations(url);
    const { file } = await runBench({
      databaseUrl: databaseUrlOn(server.serverUrl, database),
      growthDatabaseUrl: growth,
      quick: Boolean(args.quick),
      client: !args['no-client'] && !args['crew-only'] && !args['import-only'] && !args['bookings-only'] && !args['service-life-only'],
      crew:
        args['no-crew'] ? null
        : args.crew || args['crew-seconds'] ? { technicians: positiveInt('crew', args.crew, 200), seconds: positiveInt('crew-seconds', args['crew-seconds'], 60) }
        : undefined,
      crewOnly: Boolean(args['crew-only']),
      importOnly: Boolean(args['import-only']),
      bookingsOnly: Boolean(args['bookings-only']),
      serviceLifeOnly: Boolean(args['service-life-only']),
      outDir: typeof args.out === 'string' ? args.out : path.join(HERE, 'results'),
      log,
    });
    log(`Wrote ${path.relative(process.cwd(), file)}`);
  } finally {
    server.stop();
  }
}

main().then(
  () => process.exit(0),
  (err: unknown) => {
    console.error(err instanceof Error ? (err.stack ?? err.message) : err);
    process.exit(1);
  },
);

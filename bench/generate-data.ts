/**
 * `npm run bench:data [-- --appliances 100000 --seed 1 --db lifeplate_bench_100k]`: a large invented data set in
 * its own database on the local cluster (started if needed), for `npm run bench`. Without `--appliances` it makes
 * both sets the bench compares for growth: 100,000 appliances, then 10,000.
 */
import { parseArgs, positiveInt } from './lib/args';
import { benchDbName, localBenchServer } from './lib/bench-db';
import { generateBenchData } from './data/generate';

async function main() {
  const args = parseArgs(process.argv.slice(2), { appliances: 'string', seed: 'string', db: 'string', today: 'string' });
  const sizes = args.appliances === undefined ? [100_000, 10_000] : [positiveInt('appliances', args.appliances, 100_000)];
  if (typeof args.db === 'string' && sizes.length > 1) throw new Error('--db names one database: give --appliances with it.');
  const log = (line: string) => console.log(`[bench:data] ${line}`);
  const server = await localBenchServer(log);
  try {
    for (const appliances of sizes) {
      const database = typeof args.db === 'string' ? args.db : benchDbName(appliances);
      await generateBenchData({
        serverUrl: server.serverUrl,
        database,
        appliances,
        seed: positiveInt('seed', args.seed, 1),
        today: typeof args.today === 'string' ? args.today : undefined,
        log,
      });
    }
    log('Run the benchmark with: npm run bench');
  } finally {
    server.stop();
  }
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});

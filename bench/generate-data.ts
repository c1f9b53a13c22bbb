/**
 * `npm run bench:data [-- --appliances 100000 --seed 1 --db lifeplate_bench_100k]`: a large invented data set in
 * its own database on the local cluster (started if needed), for `npm run bench`.
 */
import { parseArgs, positiveInt } from './lib/args';
import { benchDbName, localBenchServer } from './lib/bench-db';
import { generateBenchData } from './data/generate';

async function main() {
  const args = parseArgs(process.argv.slice(2), { appliances: 'string', seed: 'string', db: 'string', today: 'string' });
  const appliances = positiveInt('appliances', args.appliances, 100_000);
  const database = typeof args.db === 'string' ? args.db : benchDbName(appliances);
  const log = (line: string) => console.log(`[bench:data] ${line}`);
  const server = await localBenchServer(log);
  try {
    await generateBenchData({
      serverUrl: server.serverUrl,
      database,
      appliances,
      seed: positiveInt('seed', args.seed, 1),
      today: typeof args.today === 'string' ? args.today : undefined,
      log,
    });
    log(`Run the benchmark with: npm run bench -- --db ${database}`);
  } finally {
    server.stop();
  }
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});

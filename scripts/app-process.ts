/**
 * The app itself, run by scripts/start.ts as a child process it starts again after a crash. The environment
 * (database, fakes, secret) comes from start.ts; `--dev` serves the client through Vite.
 *
 * WEB_CONCURRENCY=N (default 1) runs N HTTP workers with node:cluster, sharing the port. This process is then the
 * cluster primary: it serves no requests and runs the pg-boss scheduled jobs, exactly once, however many workers
 * there are. The primary rather than "worker 1" because it lives as long as the app: a worker that crashes is
 * replaced (with a new cluster id) without stopping or doubling the jobs, and no worker has to be told it is the
 * one. Ctrl-C or SIGTERM stops every worker (each finishes its open requests), then the jobs, then the primary.
 * `--dev` always runs one process (Vite's middleware is per process).
 */
import cluster, { type Worker } from 'node:cluster';
import { parseConfig, type AppConfig } from '../server/config';
import { startServer } from '../server/main';
import { buildContext, closeContext } from '../server/build-context';
import { startJobs } from '../server/jobs/start-jobs';
import { REMINDERS_QUEUE } from '../server/jobs/reminders-job';
import { CLIENT_DIST, PROJECT_ROOT } from './lib/paths';
import { webConcurrency } from './lib/web-concurrency';

const dev = process.argv.includes('--dev');
/** How long a worker may take to finish its requests when asked to stop before it is killed. */
const WORKER_STOP_MS = 10_000;
/** Workers that crash more often than this within a minute are not started again (the primary gives up). */
const MAX_RESTARTS_PER_MINUTE = 5;

function onStopSignal(close: () => void) {
  process.on('SIGINT', close);
  process.on('SIGTERM', close);
  // Our parent went away without stopping us: do not linger as an orphan holding the port.
  process.on('disconnect', close);
}

/** One process: the HTTP server and the jobs (WEB_CONCURRENCY=1, or --dev). */
async function runSingle(config: AppConfig) {
  let server: Awaited<ReturnType<typeof startServer>>;
  if (dev) {
    const { createServer } = await import('vite');
    const vite = await createServer({ root: PROJECT_ROOT, server: { middlewareMode: true }, appType: 'spa' });
    server = await startServer(config, { vite });
  } else {
    server = await startServer(config, { clientDir: CLIENT_DIST });
  }
  let closing = false;
  onStopSignal(() => {
    if (closing) return;
    closing = true;
    server.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  });
  if (config.FAKE_SMTP_OUTBOX && server.jobs) await sendRemindersNow(server.jobs.boss);
  process.send?.({ type: 'ready' });
}

/** Beside the local mail fake, today's reminders go out at once so the outbox has something to show; the database's once-per-period key keeps a restart from sending them again. */
async function sendRemindersNow(boss: { send: (queue: string, data: object) => Promise<unknown> }) {
  await boss.send(REMINDERS_QUEUE, {});
}

/** A cluster worker: HTTP only. It exits 0 when asked to stop, so the primary knows not to replace it. */
async function runWorker(config: AppConfig) {
  const server = await startServer(config, { clientDir: CLIENT_DIST, jobs: false });
  server.ctx.logger.info({ worker: cluster.worker?.id, pid: process.pid, port: config.PORT }, 'worker serving (no scheduled jobs)');
  let closing = false;
  onStopSignal(() => {
    if (closing) return;
    closing = true;
    server.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  });
}

/** The cluster primary: starts the jobs once and `count` workers, replaces a crashed one, stops them all on a signal. */
async function runPrimary(config: AppConfig, count: number) {
  const ctx = buildContext(config);
  const jobs = await startJobs(ctx);
  ctx.logger.info({ pid: process.pid, workers: count }, 'scheduled jobs started in the cluster primary');
  if (config.FAKE_SMTP_OUTBOX) await sendRemindersNow(jobs.boss);

  let stopping = false;
  let ready = false;
  const listening = new Set<number>();
  const crashes: number[] = [];
  const fork = () => cluster.fork();

  const stopAll = async (code: number) => {
    if (stopping) return;
    stopping = true;
    const alive = Object.values(cluster.workers ?? {}).filter((w): w is Worker => Boolean(w));
    await Promise.all(
      alive.map(
        (w) =>
          new Promise<void>((resolve) => {
            if (w.isDead()) return resolve();
            const timer = setTimeout(() => w.process.kill('SIGKILL'), WORKER_STOP_MS);
            w.once('exit', () => {
              clearTimeout(timer);
              resolve();
            });
            w.process.kill('SIGTERM');
          }),
      ),
    );
    await jobs.stop().catch((err: unknown) => ctx.logger.warn({ err }, 'stopping the job queue failed'));
    await closeContext(ctx);
    ctx.logger.info({ pid: process.pid }, 'all workers and the jobs stopped');
    process.exit(code);
  };

  cluster.on('listening', (w) => {
    listening.add(w.id);
    if (!ready && listening.size >= count) {
      ready = true;
      process.send?.({ type: 'ready' });
    }
  });
  cluster.on('exit', (w, exitCode, signal) => {
    listening.delete(w.id);
    if (stopping) return;
    if (exitCode === 0 && !signal) {
      // Stopped on purpose (a Ctrl-C reaches the workers too): the primary follows.
      void stopAll(0);
      return;
    }
    const now = Date.now();
    crashes.push(now);
    const recent = crashes.filter((t) => now - t < 60_000).length;
    ctx.logger.error({ worker: w.id, pid: w.process.pid, exitCode, signal }, 'worker stopped unexpectedly');
    if (!ready || recent > MAX_RESTARTS_PER_MINUTE) {
      ctx.logger.error({ restarts: recent }, ready ? 'workers crash too often; stopping' : 'a worker failed to start; stopping');
      void stopAll(1);
      return;
    }
    setTimeout(() => {
      if (!stopping) fork();
    }, 1000);
  });
  onStopSignal(() => void stopAll(0));
  for (let i = 0; i < count; i++) fork();
}

async function main() {
  const config = parseConfig({ NODE_ENV: dev ? 'development' : 'production', ...process.env });
  const count = dev ? 1 : webConcurrency(process.env.WEB_CONCURRENCY);
  if (cluster.isWorker) return runWorker(config);
  if (count === 1) return runSingle(config);
  return runPrimary(config, count);
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});

import fs from 'node:fs';
import http from 'node:http';
import https from 'node:https';
import type { AppConfig } from './config';
import { createApp, type AppOptions } from './app';
import { buildContext, closeContext } from './build-context';
import { startJobs } from './jobs/start-jobs';

/**
 * The HTTP server on `config.PORT`, and (unless `jobs: false`) the pg-boss scheduled jobs in the same process.
 * Under WEB_CONCURRENCY > 1 each cluster worker runs this with `jobs: false`; the primary runs the jobs
 * (scripts/app-process.ts).
 */
export async function startServer(config: AppConfig, options: AppOptions & { jobs?: boolean } = {}) {
  const ctx = buildContext(config);
  const app = createApp(ctx, options);
  const server =
    config.TLS_CERT && config.TLS_KEY
      ? https.createServer({ cert: fs.readFileSync(config.TLS_CERT), key: fs.readFileSync(config.TLS_KEY) }, app)
      : http.createServer(app);
  const closeHttp = async () => {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    server.closeAllConnections?.();
  };
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(config.PORT, config.HOST, () => resolve());
  });
  // Scheduled work (daily reminders, the orphaned photo sweep) runs in this process through pg-boss.
  let jobs: Awaited<ReturnType<typeof startJobs>> | null = null;
  try {
    if (options.jobs ?? true) jobs = await startJobs(ctx);
  } catch (err) {
    await closeHttp();
    await closeContext(ctx);
    throw err;
  }
  return {
    ctx,
    jobs,
    async close() {
      await jobs?.stop().catch((err: unknown) => ctx.logger.warn({ err }, 'stopping the job queue failed'));
      await closeHttp();
      await closeContext(ctx);
    },
  };
}

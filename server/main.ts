import fs from 'node:fs';
import http from 'node:http';
import https from 'node:https';
import type { AppConfig } from './config';
import { createApp, type AppOptions } from './app';
import { buildContext, closeContext } from './build-context';
import { sweepOrphanObjects } from './modules/photos/sweep-orphan-objects';

const SWEEP_EVERY_MS = 6 * 3_600_000;

export async function startServer(config: AppConfig, options: AppOptions = {}) {
  const ctx = buildContext(config);
  const app = createApp(ctx, options);
  const server =
    config.TLS_CERT && config.TLS_KEY
      ? https.createServer({ cert: fs.readFileSync(config.TLS_CERT), key: fs.readFileSync(config.TLS_KEY) }, app)
      : http.createServer(app);
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(config.PORT, config.HOST, () => resolve());
  });
  // Objects whose database row never got written (a crash between the two) are removed a day later.
  const sweep = setInterval(() => {
    sweepOrphanObjects(ctx, { olderThanHours: 24 })
      .then(({ deleted }) => deleted.length && ctx.logger.info({ deleted: deleted.length }, 'removed orphaned photo objects'))
      .catch((err: unknown) => ctx.logger.warn({ err }, 'orphaned photo sweep failed'));
  }, SWEEP_EVERY_MS);
  sweep.unref();
  return {
    ctx,
    async close() {
      clearInterval(sweep);
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections?.();
      await closeContext(ctx);
    },
  };
}

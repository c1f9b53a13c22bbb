import fs from 'node:fs';
import http from 'node:http';
import https from 'node:https';
import type { AppConfig } from './config';
import { createApp, type AppOptions } from './app';
import { buildContext, closeContext } from './build-context';

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
  return {
    ctx,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections?.();
      await closeContext(ctx);
    },
  };
}

/**
 * The app itself, run by scripts/start.ts as a child process it starts again after a crash. The environment
 * (database, fakes, secret) comes from start.ts; `--dev` serves the client through Vite.
 */
import { parseConfig } from '../server/config';
import { startServer } from '../server/main';
import { REMINDERS_QUEUE } from '../server/jobs/reminders-job';
import { CLIENT_DIST, PROJECT_ROOT } from './lib/paths';

const dev = process.argv.includes('--dev');

async function main() {
  const config = parseConfig({ NODE_ENV: dev ? 'development' : 'production', ...process.env });
  let server: Awaited<ReturnType<typeof startServer>>;
  if (dev) {
    const { createServer } = await import('vite');
    const vite = await createServer({ root: PROJECT_ROOT, server: { middlewareMode: true }, appType: 'spa' });
    server = await startServer(config, { vite });
  } else {
    server = await startServer(config, { clientDir: CLIENT_DIST });
  }

  let closing = false;
  const close = () => {
    if (closing) return;
    closing = true;
    server.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.on('SIGINT', close);
  process.on('SIGTERM', close);
  // start.ts went away without stopping us: do not linger as an orphan holding the port.
  process.on('disconnect', close);

  if (config.FAKE_SMTP_OUTBOX) {
    // Beside the local mail fake, today's reminders go out at once so the outbox has something to show;
    // the database's once-per-period key keeps a restart from sending them again.
    await server.jobs.boss.send(REMINDERS_QUEUE, {});
  }
  process.send?.({ type: 'ready' });
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});

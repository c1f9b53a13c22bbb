/**
 * `npm start` (and `npm run dev` with --dev): PostgreSQL, migrations, demo seed, local fakes, then the app.
 * Ctrl-C stops everything this process started.
 */
import path from 'node:path';
import { parseConfig } from '../server/config';
import { runMigrations } from '../server/db/migrate';
import { createDb } from '../server/db/client';
import { seedDemo } from '../server/db/seed/seed-demo';
import { DEMO_MEMBERS, DEMO_HOMEOWNER, DEMO_PASSWORD } from '../server/db/seed/demo-accounts';
import { startServer } from '../server/main';
import { REMINDERS_QUEUE } from '../server/jobs/reminders-job';
import { buildClientIfStale } from './lib/client-build';
import { startLocalServices } from './lib/local-services';
import { acquireLock, writeLock } from './lib/lock';
import { CLIENT_DIST, PROJECT_ROOT } from './lib/paths';
import { localDataRoot, localPgPort } from './lib/local-cluster';

const dev = process.argv.includes('--dev');
const log = (line: string) => console.log(`[lifeplate] ${line}`);

async function main() {
  const { dir: dataRoot, moved } = localDataRoot();
  if (moved) log(`The checkout is not reachable by the postgres user, so data lives in ${dataRoot}`);

  const lockFile = path.join(dataRoot, 'lifeplate.pid');
  const lock = acquireLock(lockFile);
  if (!lock.ok) {
    console.error(`Lifeplate is already running (pid ${lock.pid})${lock.url ? ` at ${lock.url}` : ''}. Stop it with Ctrl-C first.`);
    process.exit(1);
  }

  const services = await startLocalServices({
    dataRoot,
    pgPort: localPgPort(),
    database: 'lifeplate',
    s3Port: Number(process.env.FAKE_S3_PORT ?? 4569),
    smtpPort: Number(process.env.FAKE_SMTP_PORT ?? 2525),
    env: process.env,
    log,
  });
  let server: Awaited<ReturnType<typeof startServer>> | null = null;
  let stopping = false;
  const shutdown = async (code = 0) => {
    if (stopping) return;
    stopping = true;
    log('Stopping…');
    await server?.close().catch(() => {});
    await services.stop();
    lock.release();
    process.exit(code);
  };
  process.on('SIGINT', () => void shutdown(0));
  process.on('SIGTERM', () => void shutdown(0));

  try {
    Object.assign(process.env, services.env);
    const config = parseConfig({ NODE_ENV: dev ? 'development' : 'production', ...process.env });
    await runMigrations(config.DATABASE_URL);
    const { db, pool } = createDb(config.DATABASE_URL, { max: 2 });
    const { seeded } = await seedDemo(db);
    await pool.end();
    log(seeded ? 'Seeded the demo scenario.' : 'Demo data already present.');

    if (dev) {
      const { createServer } = await import('vite');
      const vite = await createServer({ root: PROJECT_ROOT, server: { middlewareMode: true }, appType: 'spa' });
      server = await startServer(config, { vite });
    } else {
      await buildClientIfStale(CLIENT_DIST);
      server = await startServer(config, { clientDir: CLIENT_DIST });
    }
    if (config.FAKE_SMTP_OUTBOX) {
      // Beside the local mail fake, today's reminders go out at once so the outbox has something to show;
      // the database's once-per-period key keeps a restart from sending them again.
      await server.jobs.boss.send(REMINDERS_QUEUE, {});
    }
    writeLock(lockFile, config.BASE_URL);
    console.log(`
  Lifeplate is running at ${config.BASE_URL}

  Demo accounts (password: ${DEMO_PASSWORD})
${DEMO_MEMBERS.map((m) => `    ${m.email.padEnd(26)} ${m.role}${m.company === 'other' ? ' (second company)' : ''}`).join('\n')}
    ${DEMO_HOMEOWNER.email.padEnd(26)} homeowner

  Press Ctrl-C to stop.
`);
  } catch (err) {
    console.error(err instanceof Error ? err.message : err);
    await shutdown(1);
  }
}

void main();

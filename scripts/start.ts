/**
 * `npm start` (and `npm run dev` with --dev): PostgreSQL, migrations, demo seed, local fakes, then the app in a
 * child process (scripts/app-process.ts), started again if it crashes. Ctrl-C stops everything this process started.
 */
import { fork } from 'node:child_process';
import path from 'node:path';
import { parseConfig } from '../server/config';
import { runMigrations } from '../server/db/migrate';
import { createDb } from '../server/db/client';
import { seedDemo } from '../server/db/seed/seed-demo';
import { queueDemoBookingConfirmations } from '../server/db/seed/demo-booking-confirmations';
import { createMailer } from '../server/lib/mailer';
import { createMailQueue } from '../server/modules/mail/mail-queue';
import { DEMO_MEMBERS, DEMO_HOMEOWNER, DEMO_PASSWORD } from '../server/db/seed/demo-accounts';
import { buildClientIfStale } from './lib/client-build';
import { startLocalServices } from './lib/local-services';
import { acquireLock, writeLock } from './lib/lock';
import { CLIENT_DIST } from './lib/paths';
import { localDataRoot, localPgPort } from './lib/local-cluster';
import { supervise } from './lib/supervise';
import { appDatabaseName } from './lib/settings';

const dev = process.argv.includes('--dev');
const log = (line: string) => console.log(`[lifeplate] ${line}`);
const APP_PROCESS = path.join(import.meta.dirname, 'app-process.ts');

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
    database: appDatabaseName(dataRoot),
    s3Port: Number(process.env.FAKE_S3_PORT ?? 4569),
    smtpPort: Number(process.env.FAKE_SMTP_PORT ?? 2525),
    env: process.env,
    log,
  });
  let app: ReturnType<typeof supervise> | null = null;
  let stopping = false;
  const shutdown = async (code = 0) => {
    if (stopping) return;
    stopping = true;
    log('Stopping…');
    await app?.stop().catch(() => {});
    await services.stop();
    lock.release();
    process.exit(code);
  };
  process.on('SIGINT', () => void shutdown(0));
  process.on('SIGTERM', () => void shutdown(0));
  // This process holds the fakes and the cluster: if it fails itself, stop them all rather than leave them behind.
  process.on('uncaughtException', (err) => {
    console.error('[lifeplate] Stopping everything after an unexpected error:', err);
    void shutdown(1);
  });

  try {
    // Someone at a terminal reads this output (ours and the app child's): short lines, unless LOG_FORMAT=json is asked for.
    process.env.LOG_FORMAT ??= 'pretty';
    Object.assign(process.env, services.env);
    const config = parseConfig({ NODE_ENV: dev ? 'development' : 'production', ...process.env });
    await runMigrations(config.DATABASE_URL);
    const { db, pool } = createDb(config.DATABASE_URL, { max: 2 });
    const { seeded } = await seedDemo(db);
    log(seeded ? 'Seeded the demo scenario.' : 'Demo data already present.');
    // The homeowners' confirmations of the seeded bookings, once: sent now to the mail fake, else by the app's mail job.
    const mailer = createMailer(config);
    const mail = createMailQueue({ db, mailer, secret: config.BETTER_AUTH_SECRET, logger: { warn: (_obj: unknown, msg?: string) => log(msg ?? 'mail warning') } });
    const confirmations = await queueDemoBookingConfirmations(db, { mail, config });
    for (const id of confirmations) await mail.deliver(id);
    mailer.close();
    if (confirmations.length) log(`Queued ${confirmations.length} booking confirmations for the demo homeowners (see /outbox).`);
    await pool.end();

    if (!dev) await buildClientIfStale(CLIENT_DIST);
    // A child process, so a crash of the app leaves this one to say so and start it again.
    app = supervise({
      spawn: () => fork(APP_PROCESS, dev ? ['--dev'] : [], { env: process.env }),
      log,
      onReady: (first) => {
        if (first) announce(config.BASE_URL);
        else log(`The app is running again at ${config.BASE_URL}`);
      },
    });
    writeLock(lockFile, config.BASE_URL);
    const end = await app.ended;
    if (end.reason !== 'stopped') await shutdown(1);
  } catch (err) {
    console.error(err instanceof Error ? err.message : err);
    await shutdown(1);
  }
}

function announce(baseUrl: string) {
  console.log(`
  Lifeplate is running at ${baseUrl}

  Demo accounts (password: ${DEMO_PASSWORD})
${DEMO_MEMBERS.map((m) => `    ${m.email.padEnd(26)} ${m.role}${m.company === 'other' ? ' (second company)' : ''}`).join('\n')}
    ${DEMO_HOMEOWNER.email.padEnd(26)} homeowner

  Press Ctrl-C to stop.
`);
}

void main();

import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { startFakeS3 } from '../../fakes/s3';
import { startFakeSmtp } from '../../fakes/smtp';
import { clusterUrl, ensureDatabase } from './postgres';
import { clusterIn, ensureClusterRunning } from './local-cluster';

type Stopper = () => Promise<void> | void;

/**
 * Starts what the app needs on loopback and is not configured from outside: PostgreSQL (unless DATABASE_URL),
 * the S3 fake (unless S3_ENDPOINT) and the SMTP fake (unless SMTP_HOST). Returns the env to run the app with.
 */
export async function startLocalServices(opts: {
  dataRoot: string;
  pgPort: number;
  database: string;
  s3Port: number;
  smtpPort: number;
  env: NodeJS.ProcessEnv;
  log: (line: string) => void;
}) {
  const env: NodeJS.ProcessEnv = {};
  const stoppers: Stopper[] = [];

  if (!opts.env.DATABASE_URL) {
    const cluster = clusterIn(opts.dataRoot, opts.pgPort);
    const running = ensureClusterRunning(cluster);
    if (running.created) opts.log(`Created a PostgreSQL cluster in ${cluster.dataDir}`);
    if (running.started) stoppers.push(running.stop);
    await ensureDatabase(opts.pgPort, opts.database);
    env.DATABASE_URL = clusterUrl(opts.pgPort, opts.database);
    opts.log(`PostgreSQL on 127.0.0.1:${opts.pgPort} (data in ${cluster.dataDir})`);
  }

  if (!opts.env.S3_ENDPOINT) {
    const s3 = await startFakeS3({ port: opts.s3Port, directory: path.join(opts.dataRoot, 's3'), bucket: opts.env.S3_BUCKET ?? 'lifeplate' });
    stoppers.push(() => s3.close());
    env.S3_ENDPOINT = s3.endpoint;
    opts.log(`S3 fake on ${s3.endpoint}`);
  }

  if (!opts.env.SMTP_HOST) {
    const smtp = await startFakeSmtp({ port: opts.smtpPort, directory: path.join(opts.dataRoot, 'outbox') });
    stoppers.push(() => smtp.close());
    env.SMTP_HOST = '127.0.0.1';
    env.SMTP_PORT = String(smtp.port);
    env.FAKE_SMTP_OUTBOX = smtp.directory;
    opts.log(`SMTP fake on 127.0.0.1:${smtp.port}`);
  }

  if (!opts.env.BETTER_AUTH_SECRET) {
    const secretFile = path.join(opts.dataRoot, 'auth-secret');
    if (!fs.existsSync(secretFile)) fs.writeFileSync(secretFile, crypto.randomBytes(32).toString('hex'), { mode: 0o600 });
    env.BETTER_AUTH_SECRET = fs.readFileSync(secretFile, 'utf8').trim();
  }

  return {
    env,
    async stop() {
      for (const stop of stoppers.reverse()) {
        try {
          await stop();
        } catch {
          // keep stopping the rest
        }
      }
    },
  };
}

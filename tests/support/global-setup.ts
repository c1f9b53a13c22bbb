import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { execFileSync } from 'node:child_process';
import type { TestProject } from 'vitest/node';
import { clusterUrl, ensureCluster, ensureDatabase, findPgBin, startCluster, stopCluster, type Cluster } from '../../scripts/lib/postgres';
import { runMigrations } from '../../server/db/migrate';
import { startFakeS3 } from '../../fakes/s3';
import { startFakeSmtp } from '../../fakes/smtp';

const TEST_BUCKET = 'lifeplate-test';

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
    runDir: string;
    s3Endpoint: string;
    s3Bucket: string;
    smtpPort: number;
    outboxDir: string;
  }
}

/**
 * One throwaway PostgreSQL cluster for the whole run, on its own port and folder, so `npm test` can run beside
 * `npm start`. Everything started here is stopped in the teardown, whether tests passed or not.
 */
export default async function setup(project: TestProject) {
  const runDir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-test-'));
  fs.chmodSync(runDir, 0o755);
  const cluster: Cluster = { bin: findPgBin(), dataDir: path.join(runDir, 'pg'), port: await freePort(), logFile: path.join(runDir, 'postgres.log') };
  process.env.LIFEPLATE_PG_FSYNC = 'off';
  ensureCluster(cluster);
  startCluster(cluster);
  let s3: Awaited<ReturnType<typeof startFakeS3>> | undefined;
  let smtp: Awaited<ReturnType<typeof startFakeSmtp>> | undefined;
  const teardown = async () => {
    try {
      await s3?.close();
      await smtp?.close();
    } catch {
      // best effort
    }
    stopCluster(cluster);
    try {
      execFileSync('rm', ['-rf', runDir]);
    } catch {
      // best effort
    }
  };
  try {
    await ensureDatabase(cluster.port, 'lifeplate_test');
    const databaseUrl = clusterUrl(cluster.port, 'lifeplate_test');
    await runMigrations(databaseUrl);
    project.provide('databaseUrl', databaseUrl);
    project.provide('runDir', runDir);
    s3 = await startFakeS3({ port: await freePort(), directory: path.join(runDir, 's3'), bucket: TEST_BUCKET });
    project.provide('s3Endpoint', s3.endpoint);
    project.provide('s3Bucket', TEST_BUCKET);
    smtp = await startFakeSmtp({ port: await freePort(), directory: path.join(runDir, 'outbox') });
    project.provide('smtpPort', smtp.port);
    project.provide('outboxDir', smtp.directory);
  } catch (err) {
    await teardown();
    throw err;
  }
  return teardown;
}

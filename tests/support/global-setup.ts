import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { execFileSync } from 'node:child_process';
import type { TestProject } from 'vitest/node';
import { clusterUrl, ensureCluster, ensureDatabase, findPgBin, startCluster, stopCluster, type Cluster } from '../../scripts/lib/postgres';
import { runMigrations } from '../../server/db/migrate';

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
  const teardown = () => {
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
  } catch (err) {
    teardown();
    throw err;
  }
  return teardown;
}

import path from 'node:path';
import { CHECKOUT_ID, PROJECT_ROOT } from './paths';
import { ensureCluster, findPgBin, isClusterRunning, resolveDataRoot, startCluster, stopCluster, type Cluster } from './postgres';

/** The checkout's data folder (`.data`, or /var/lib/lifeplate/<checkout> when the postgres user cannot reach it). */
export function localDataRoot(env: NodeJS.ProcessEnv = process.env) {
  return resolveDataRoot(env.LIFEPLATE_DATA_DIR ?? path.join(PROJECT_ROOT, '.data'), CHECKOUT_ID);
}

export const localPgPort = (env: NodeJS.ProcessEnv = process.env) => Number(env.PG_PORT ?? 54329);

/** The PostgreSQL cluster `npm start` runs, described for a data folder and port. */
export function clusterIn(dataRoot: string, port: number): Cluster {
  return { bin: findPgBin(), dataDir: path.join(dataRoot, 'pg'), port, logFile: path.join(dataRoot, 'postgres.log') };
}

/**
 * Makes sure the cluster exists and runs. Returns a stop function that stops it only if this call started it,
 * so a cluster `npm start` is using keeps running.
 */
export function ensureClusterRunning(cluster: Cluster): { created: boolean; started: boolean; stop: () => void } {
  const { created } = ensureCluster(cluster);
  if (isClusterRunning(cluster)) return { created, started: false, stop: () => {} };
  startCluster(cluster);
  return { created, started: true, stop: () => stopCluster(cluster) };
}

import { execFile, execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';

const isRoot = () => process.getuid?.() === 0;
export const DB_USER = 'lifeplate';

export function findPgBin(): string {
  const root = '/usr/lib/postgresql';
  const pick = () => {
    if (!fs.existsSync(root)) return null;
    const versions = fs
      .readdirSync(root)
      .filter((v) => fs.existsSync(path.join(root, v, 'bin', 'initdb')))
      .sort((a, b) => Number(b) - Number(a));
    return versions[0] ? path.join(root, versions[0], 'bin') : null;
  };
  const found = pick();
  if (found) return found;
  if (!isRoot()) {
    throw new Error('PostgreSQL server binaries are missing. Install them with:\n  sudo apt-get install -y postgresql');
  }
  console.log('Installing PostgreSQL from Debian packages (apt-get install -y postgresql)…');
  execFileSync('apt-get', ['update'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', 'postgresql'], { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
  const installed = pick();
  if (!installed) throw new Error('apt-get installed postgresql but no initdb was found under /usr/lib/postgresql');
  return installed;
}

/** Runs a PostgreSQL tool, as the postgres user when we are root (initdb and postgres refuse to run as root). */
function pgCommand(bin: string, tool: string, args: string[]): [string, string[]] {
  const exe = path.join(bin, tool);
  return isRoot() ? ['runuser', ['-u', 'postgres', '--', exe, ...args]] : [exe, args];
}

function runPg(bin: string, tool: string, args: string[], opts: { allowFail?: boolean } = {}) {
  const [cmd, argv] = pgCommand(bin, tool, args);
  const res = spawnSync(cmd, argv, { encoding: 'utf8' });
  if (res.status !== 0 && !opts.allowFail) {
    throw new Error(`${tool} ${args.join(' ')} failed (${res.status}):\n${res.stderr || res.stdout}`);
  }
  return res;
}

function canPostgresReach(dir: string): boolean {
  if (!isRoot()) return true;
  return spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dir]).status === 0;
}

/**
 * Where the cluster lives. As root, the postgres user must be able to reach the folder; a checkout under /root is
 * not reachable, so the cluster moves to /var/lib/lifeplate/<name> and we say so.
 */
export function resolveDataRoot(preferred: string, fallbackName: string): { dir: string; moved: boolean } {
  fs.mkdirSync(preferred, { recursive: true });
  if (canPostgresReach(preferred)) return { dir: preferred, moved: false };
  const dir = path.join('/var/lib/lifeplate', fallbackName);
  fs.mkdirSync(dir, { recursive: true });
  return { dir, moved: true };
}

export type Cluster = { bin: string; dataDir: string; port: number; logFile: string };

export function ensureCluster(cluster: Cluster) {
  const { bin, dataDir } = cluster;
  if (fs.existsSync(path.join(dataDir, 'PG_VERSION'))) return { created: false };
  fs.mkdirSync(dataDir, { recursive: true, mode: 0o700 });
  if (isRoot()) execFileSync('chown', ['-R', 'postgres:postgres', path.dirname(dataDir)]);
  runPg(bin, 'initdb', ['-D', dataDir, '-U', DB_USER, '--auth=trust', '--encoding=UTF8', '--locale=C.UTF-8', '--no-instructions']);
  fs.appendFileSync(
    path.join(dataDir, 'postgresql.conf'),
    `\n# Lifeplate: loopback only, socket kept inside the data folder\nlisten_addresses = '127.0.0.1'\nunix_socket_directories = '${dataDir}'\nfsync = ${process.env.LIFEPLATE_PG_FSYNC ?? 'on'}\n`,
  );
  if (isRoot()) execFileSync('chown', ['-R', 'postgres:postgres', dataDir]);
  return { created: true };
}

export function isClusterRunning(cluster: Cluster): boolean {
  return runPg(cluster.bin, 'pg_ctl', ['-D', cluster.dataDir, 'status'], { allowFail: true }).status === 0;
}

export function startCluster(cluster: Cluster) {
  if (isRoot() && !fs.existsSync(cluster.logFile)) {
    fs.writeFileSync(cluster.logFile, '');
    execFileSync('chown', ['postgres:postgres', cluster.logFile]);
  }
  runPg(cluster.bin, 'pg_ctl', ['-D', cluster.dataDir, '-l', cluster.logFile, '-o', `-p ${cluster.port}`, '-w', '-t', '60', 'start']);
}

export function stopCluster(cluster: Cluster) {
  runPg(cluster.bin, 'pg_ctl', ['-D', cluster.dataDir, '-m', 'fast', '-w', 'stop'], { allowFail: true });
}

/** Like runPg, without blocking the event loop: clients in this process see the server go and come back as it happens. */
function runPgAsync(bin: string, tool: string, args: string[]) {
  const [cmd, argv] = pgCommand(bin, tool, args);
  return new Promise<void>((resolve, reject) => {
    execFile(cmd, argv, { encoding: 'utf8' }, (err, stdout, stderr) =>
      err ? reject(new Error(`${tool} ${args.join(' ')} failed:\n${stderr || stdout}`)) : resolve(),
    );
  });
}

/** Fast shutdown (open sessions are ended with 57P01) and start again, e.g. to test surviving a restart. */
export const stopClusterAsync = (cluster: Cluster) => runPgAsync(cluster.bin, 'pg_ctl', ['-D', cluster.dataDir, '-m', 'fast', '-w', 'stop']);
export const startClusterAsync = (cluster: Cluster) =>
  runPgAsync(cluster.bin, 'pg_ctl', ['-D', cluster.dataDir, '-l', cluster.logFile, '-o', `-p ${cluster.port}`, '-w', '-t', '60', 'start']);

export function clusterUrl(port: number, database: string) {
  return `postgres://${DB_USER}@127.0.0.1:${port}/${database}`;
}

export async function ensureDatabase(port: number, database: string) {
  const client = new pg.Client({ connectionString: clusterUrl(port, 'postgres') });
  await client.connect();
  try {
    const { rowCount } = await client.query('select 1 from pg_database where datname = $1', [database]);
    if (!rowCount) await client.query(`create database "${database.replace(/"/g, '')}"`);
  } finally {
    await client.end();
  }
}

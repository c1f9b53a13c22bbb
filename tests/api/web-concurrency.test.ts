import { spawn, type ChildProcess } from 'node:child_process';
import http from 'node:http';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { runMigrations } from '../../server/db/migrate';
import { freePort } from '../support/global-setup';
import { webConcurrency } from '../../scripts/lib/web-concurrency';

// scripts/app-process.ts with WEB_CONCURRENCY=2, as `npm start` runs it: a cluster primary and two HTTP workers on
// one port. The app gets a database of its own, so its scheduled jobs never touch the other test files' rows.
const ROOT = path.resolve(import.meta.dirname, '../..');
const testDbUrl = new URL(inject('databaseUrl'));
const database = `lifeplate_wc_${process.pid}_${Date.now().toString(36)}`;
const adminUrl = new URL(testDbUrl);
adminUrl.pathname = '/postgres';
const appDbUrl = new URL(testDbUrl);
appDbUrl.pathname = `/${database}`;

let child: ChildProcess;
let port: number;
let output = '';
type LogLine = { msg?: string; pid?: number; worker?: number };
const logLines = (): LogLine[] =>
  output
    .split('\n')
    .filter((l) => l.startsWith('{'))
    .map((l) => JSON.parse(l) as LogLine);

async function admin(sql: string) {
  const client = new pg.Client({ connectionString: adminUrl.toString() });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

/** GET /api/health on a new connection each time (so the cluster's round robin hands it to the next worker). */
function health(): Promise<{ status: number; body: { status: string; worker?: { id: number; pid: number } } }> {
  return new Promise((resolve, reject) => {
    const req = http.get({ host: '127.0.0.1', port, path: '/api/health', agent: false, headers: { connection: 'close' } }, (res) => {
      let text = '';
      res.on('data', (c) => (text += c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body: JSON.parse(text) }));
    });
    req.on('error', reject);
  });
}

beforeAll(async () => {
  await admin(`create database ${database}`);
  await runMigrations(appDbUrl.toString());
  port = await freePort();
  child = spawn(process.execPath, ['--import', 'tsx', path.join(ROOT, 'scripts/app-process.ts')], {
    cwd: ROOT,
    env: {
      PATH: process.env.PATH,
      HOME: process.env.HOME,
      WEB_CONCURRENCY: '2',
      PORT: String(port),
      DATABASE_URL: appDbUrl.toString(),
      BETTER_AUTH_SECRET: 'test-secret-test-secret-test-secret-0123',
      LOG_LEVEL: 'info',
      LOG_FORMAT: 'json',
    },
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
  });
  child.stdout!.on('data', (c) => (output += c));
  child.stderr!.on('data', (c) => (output += c));
  await new Promise<void>((resolve, reject) => {
    child.on('message', (m: { type?: string }) => m?.type === 'ready' && resolve());
    child.once('exit', (code) => reject(new Error(`the app exited (${code}) before it was ready:\n${output}`)));
  });
}, 120_000);

afterAll(async () => {
  if (child && child.exitCode === null) child.kill('SIGKILL');
  await admin(`drop database if exists ${database} with (force)`);
});

describe('WEB_CONCURRENCY', () => {
  it('reads 1 when unset and refuses what is not a worker count', () => {
    expect(webConcurrency(undefined)).toBe(1);
    expect(webConcurrency('')).toBe(1);
    expect(webConcurrency('3')).toBe(3);
    for (const bad of ['0', '-1', '1.5', 'two', '33']) expect(() => webConcurrency(bad), bad).toThrow(/WEB_CONCURRENCY/);
  });

  it('answers from two worker processes, with the scheduled jobs started once, in the primary', async () => {
    const pids = new Set<number>();
    for (let i = 0; i < 20 && pids.size < 2; i++) {
      const res = await health();
      expect(res.status).toBe(200);
      expect(res.body.status).toBe('ok');
      pids.add(res.body.worker!.pid);
    }
    expect(pids.size).toBe(2);
    expect(pids.has(child.pid!)).toBe(false);

    const lines = logLines();
    const serving = lines.filter((l) => l.msg === 'worker serving (no scheduled jobs)');
    expect(new Set(serving.map((l) => l.pid))).toEqual(pids);
    const jobs = lines.filter((l) => l.msg === 'scheduled jobs started in the cluster primary');
    expect(jobs).toHaveLength(1);
    expect(jobs[0].pid).toBe(child.pid);
  });

  it('stops every worker, then itself, on SIGTERM', async () => {
    const workers = logLines()
      .filter((l) => l.msg === 'worker serving (no scheduled jobs)')
      .map((l) => l.pid!);
    const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
    child.kill('SIGTERM');
    expect(await exited).toBe(0);
    expect(logLines().some((l) => l.msg === 'all workers and the jobs stopped')).toBe(true);
    const alive = (pid: number) => {
      try {
        process.kill(pid, 0);
        return true;
      } catch {
        return false;
      }
    };
    expect(workers.filter(alive)).toEqual([]);
  }, 30_000);
});

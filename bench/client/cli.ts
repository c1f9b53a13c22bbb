/**
 * The client figures on their own: `npx tsx bench/client/cli.ts [--quick] [--client-dir <dir>] [--json]`.
 * Builds the client (if stale), starts a throwaway PostgreSQL with the demo seed and the app on a free port,
 * signs the demo technician in, makes a share link, and prints the rows bench/run.ts would get.
 * `--serve` keeps that app up instead and prints its addresses and the technician's cookie (for looking at a page by hand).
 */
import fs from 'node:fs';
import http from 'node:http';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseConfig } from '../../server/config';
import { buildContext, closeContext } from '../../server/build-context';
import { createApp } from '../../server/app';
import { createLogger } from '../../server/logger';
import { runMigrations } from '../../server/db/migrate';
import { seedDemo } from '../../server/db/seed/seed-demo';
import { DEMO_COMPANY, DEMO_PASSWORD } from '../../server/db/seed/demo-accounts';
import { clusterUrl, ensureCluster, ensureDatabase, findPgBin, startCluster, stopCluster } from '../../scripts/lib/postgres';
import { buildClientIfStale } from '../../scripts/lib/client-build';
import { CLIENT_DIST } from '../../scripts/lib/paths';
import { measureClientFigures } from './index';

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

const arg = (name: string) => {
  const i = process.argv.indexOf(name);
  return i >= 0 ? process.argv[i + 1] : undefined;
};

async function signInCookie(baseUrl: string, email: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: baseUrl },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (!res.ok) throw new Error(`sign-in as ${email} failed: ${res.status}`);
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

/** The demo app on a free port against a throwaway PostgreSQL, with what the client figures need. */
export async function startDemoApp(clientDir: string) {
  const runDir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-bench-client-'));
  fs.chmodSync(runDir, 0o755);
  const cluster = { bin: findPgBin(), dataDir: path.join(runDir, 'pg'), port: await freePort(), logFile: path.join(runDir, 'postgres.log') };
  process.env.LIFEPLATE_PG_FSYNC = 'off';
  ensureCluster(cluster);
  startCluster(cluster);
  let closeServer = async () => {};
  const close = async () => {
    await closeServer();
    stopCluster(cluster);
    fs.rmSync(runDir, { recursive: true, force: true });
  };
  try {
    await ensureDatabase(cluster.port, 'lifeplate_bench');
    const databaseUrl = clusterUrl(cluster.port, 'lifeplate_bench');
    await runMigrations(databaseUrl);
    const port = await freePort();
    const baseUrl = `http://127.0.0.1:${port}`;
    const config = parseConfig({
      NODE_ENV: 'production',
      DATABASE_URL: databaseUrl,
      BASE_URL: baseUrl,
      PORT: String(port),
      BETTER_AUTH_SECRET: 'bench-secret-bench-secret-bench-secret-01',
      LOG_LEVEL: 'silent',
      SIGN_IN_RATE_LIMIT: '100000',
    });
    const ctx = buildContext(config, { logger: createLogger('silent') });
    await seedDemo(ctx.db);
    const server = http.createServer(createApp(ctx, { clientDir }));
    await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
    closeServer = async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await closeContext(ctx);
    };

    // The demo appliance with the longest history: the heaviest record a technician opens.
    const { rows } = await ctx.pool.query<{ id: string }>(
      `select a.id from appliances a join companies c on c.id = a.company_id where c.name = $1
       order by (select count(*) from timeline_events t where t.appliance_id = a.id) desc limit 1`,
      [DEMO_COMPANY.name],
    );
    const applianceId = rows[0].id;
    const techCookie = await signInCookie(baseUrl, 'tech@demo.test');
    const managerCookie = await signInCookie(baseUrl, 'manager@demo.test');
    const made = await fetch(`${baseUrl}/api/appliances/${applianceId}/share-links`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Cookie: managerCookie, Origin: baseUrl },
      body: JSON.stringify({ expiresInDays: 30 }),
    });
    if (!made.ok) throw new Error(`share link not made: ${made.status} ${await made.text()}`);
    const { url: shareUrl } = (await made.json()) as { url: string };
    return { baseUrl, cookie: techCookie, shareUrl, recordUrl: `${baseUrl}/appliances/${applianceId}`, close };
  } catch (err) {
    await close();
    throw err;
  }
}

async function main() {
  const clientDir = path.resolve(arg('--client-dir') ?? CLIENT_DIST);
  if (!arg('--client-dir')) await buildClientIfStale(clientDir);
  const demo = await startDemoApp(clientDir);
  if (process.argv.includes('--serve')) {
    console.log(JSON.stringify({ baseUrl: demo.baseUrl, cookie: demo.cookie, shareUrl: demo.shareUrl, recordUrl: demo.recordUrl }));
    process.on('SIGINT', () => void demo.close().then(() => process.exit(0)));
    process.on('SIGTERM', () => void demo.close().then(() => process.exit(0)));
    return;
  }
  try {
    const figures = await measureClientFigures({ ...demo, quick: process.argv.includes('--quick'), clientDir });
    if (process.argv.includes('--json')) console.log(JSON.stringify(figures, null, 2));
    else console.table(figures.map(({ figure, value, unit, target, met, note }) => ({ figure, value, unit, target, met, note: note ?? '' })));
  } finally {
    await demo.close();
  }
}

// Run as a command only; bench/lighthouse.ts imports startDemoApp from here.
if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main().catch((err: unknown) => {
    console.error(err);
    process.exitCode = 1;
  });
}

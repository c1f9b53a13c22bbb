import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import * as schema from '../../server/db/schema/index';
import type { Db } from '../../server/db/client';
import { startFakeS3 } from '../../fakes/s3';
import { createObjectStorage } from '../../server/lib/object-storage';
import { CLIENT_DIST } from '../../scripts/lib/paths';
import { buildClientIfStale } from '../../scripts/lib/client-build';
import { readBenchMeta } from '../data/bench-meta';
import { databaseNameOf } from '../lib/bench-db';
import type { BenchFigure } from '../lib/figure';
import { growthRows, latencyRows, measureLatencySet, tagRow, throughputRows, warmUp, type AppRun, type LatencySet } from './app-figures';
import { bootApp, signIn } from './boot';
import { explainDueQuery } from './explain-due';
import { DUE_WINDOW_DAYS } from './endpoints';
import { median, round, SHARED_CORES_NOTE, type Scale } from './measure';
import { timePhotoPipeline, twelveMegapixelJpeg } from './photo-pipeline';
import { formatTable, machineFacts, writeResults } from './report';
import { loadSamples } from './samples';
import { measureClientHalf } from './client-half';
import { crewRows, FULL_CREW, QUICK_CREW, type CrewScale } from './crew-figures';
import { importRows } from './import-figure';
import { bookingRows } from './booking-figures';
import { serviceLifeRows } from './service-life-figures';

export type RunOptions = {
  databaseUrl: string;
  /** The smaller data set for the growth figures; null skips them. */
  growthDatabaseUrl: string | null;
  quick: boolean;
  outDir: string;
  /** Also run the client half (bench/client) against the served client build. */
  client: boolean;
  log: (line: string) => void;
  /** Where the table goes (default: stdout). */
  print?: (text: string) => void;
  /** Concurrent technicians (default 200 for 60 s, quick 10 for 3 s); null skips them. */
  crew?: CrewScale | null;
  /** Only the concurrent technicians (written to <date>-crew.json, so a full run's file is kept). */
  crewOnly?: boolean;
  /** Only the import figures (written to <date>-import.json). */
  importOnly?: boolean;
  /** Only the booking figures (written to <date>-bookings.json). */
  bookingsOnly?: boolean;
  /** Only the learned service-life figures (written to <date>-service-life.json). */
  serviceLifeOnly?: boolean;
};

const S3_BUCKET = 'lifeplate-bench';

async function withApp<T>(databaseUrl: string, s3Endpoint: string, clientDir: string | undefined, fn: (run: AppRun) => Promise<T>): Promise<T> {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 1 });
  const meta = await readBenchMeta(pool).finally(() => pool.end());
  const app = await bootApp({ databaseUrl, s3Endpoint, s3Bucket: S3_BUCKET, clientDir });
  try {
    const manager = meta.members.find((m) => m.role === 'manager') ?? meta.members[0];
    const cookie = await signIn(app.baseUrl, manager.email, meta.password);
    const samples = await loadSamples(app.ctx.pool, meta.companyId);
    return await fn({ baseUrl: app.baseUrl, cookie, databaseUrl, meta, samples });
  } finally {
    await app.close();
  }
}

export async function runBench(opts: RunOptions): Promise<{ figures: BenchFigure[]; file: string }> {
  const scale: Scale = { quick: opts.quick };
  const log = opts.log;
  const s3Dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-bench-s3-'));
  const s3 = await startFakeS3({ port: 0, directory: s3Dir, bucket: S3_BUCKET });
  const figures: BenchFigure[] = [];
  let plan: Awaited<ReturnType<typeof explainDueQuery>> | null = null;
  let meta: AppRun['meta'] | null = null;
  let growthMeta: AppRun['meta'] | null = null;
  try {
    if (opts.client) await buildClientIfStale(CLIENT_DIST, { quiet: true });
    const clientDir = opts.client ? CLIENT_DIST : undefined;
    let big: LatencySet | null = null;

    if (!opts.importOnly) {
      await withApp(opts.databaseUrl, s3.endpoint, clientDir, async (run) => {
        meta = run.meta;
        log(`Database ${databaseNameOf(opts.databaseUrl)}: ${Object.entries(run.meta.counts).map(([k, v]) => `${v} ${k}`).join(', ')}`);
        if (opts.crewOnly) {
          figures.push(...(await crewRows(run, scale, opts.crew ?? (scale.quick ? QUICK_CREW : FULL_CREW), log)));
          return;
        }
        if (opts.bookingsOnly) {
          await warmUp(run, scale);
          figures.push(...(await bookingRows(run, scale)));
          return;
        }
        if (opts.serviceLifeOnly) {
          await warmUp(run, scale);
          figures.push(...(await serviceLifeRows(run, scale)));
          return;
        }
        log('Warming up…');
        await warmUp(run, scale);
        log('Latency at fixed rates (timeline, search, due, stock)…');
        big = await measureLatencySet(run, scale);
        figures.push(...latencyRows(big));
        log('Tag resolution…');
        figures.push(await tagRow(run, scale));
        log('Bookings: week board, round with load list, insert…');
        figures.push(...(await bookingRows(run, scale)));
        log('Learned service life: one part type\'s fleet curve…');
        figures.push(...(await serviceLifeRows(run, scale)));
        log('Throughput at 50 connections, then pgbench on the same SQL…');
        figures.push(...(await throughputRows(run, scale)));

        log('EXPLAIN the due query…');
        const pool = new pg.Pool({ connectionString: opts.databaseUrl, max: 1 });
        try {
          const db = drizzle(pool, { schema, casing: 'snake_case' }) as unknown as Db;
          plan = await explainDueQuery(db, pool, run.meta.companyId, DUE_WINDOW_DAYS, 100);
        } finally {
          await pool.end();
        }
        const p = plan;
        figures.push({
          figure: `Due query plan (EXPLAIN ANALYZE, first page)`,
          load: 'single query',
          value: round(p.executionMs, 2),
          unit: 'ms',
          target: 'index scan, no full-table sort',
          met: p.usesIndexScan && !p.fullTableSort,
          note: `top node: ${p.topNode}; index scan on components: ${p.usesIndexScan ? 'yes' : 'no'}; full-table sort: ${p.fullTableSort ? 'yes' : 'no'}${p.seqScans.length ? `; seq scans: ${p.seqScans.join(', ')}` : ''}`,
        });

        const crew = opts.crew === undefined ? (scale.quick ? QUICK_CREW : FULL_CREW) : opts.crew;
        if (crew) figures.push(...(await crewRows(run, scale, crew, log)));

        if (opts.client) figures.push(...(await measureClientHalf(run, scale, log)));
      });
    }

    if (!opts.crewOnly && !opts.bookingsOnly && !opts.serviceLifeOnly) {
      log('Import…');
      figures.push(...(await importRows({ databaseUrl: opts.databaseUrl, s3Endpoint: s3.endpoint, s3Bucket: S3_BUCKET }, scale, log)));
    }
    if (!opts.crewOnly && !opts.importOnly && !opts.bookingsOnly && !opts.serviceLifeOnly) {
      log('Photo pipeline…');
      const storage = createObjectStorage({ S3_ENDPOINT: s3.endpoint, S3_REGION: 'us-east-1', S3_BUCKET, S3_ACCESS_KEY_ID: 'S3RVER', S3_SECRET_ACCESS_KEY: 'S3RVER' });
      try {
        const jpeg = await twelveMegapixelJpeg();
        const times = await timePhotoPipeline(storage, jpeg, scale.quick ? 1 : 5);
        figures.push({
          figure: 'Photo: 12 MP JPEG → display image + thumbnail, both stored',
          load: 'one at a time',
          value: round(median(times), 0),
          unit: 'ms',
          target: '≤ 1000 ms',
          met: median(times) <= 1000,
          note: `processImage + 2 puts to the S3 fake; ${(jpeg.length / 2 ** 20).toFixed(1)} MB input; median of ${times.length}, slowest ${round(Math.max(...times), 0)} ms`,
        });
      } finally {
        storage.destroy();
      }

      if (opts.growthDatabaseUrl && big) {
        const bigSet: LatencySet = big;
        log(`Growth: the same latency figures on ${databaseNameOf(opts.growthDatabaseUrl)}…`);
        await withApp(opts.growthDatabaseUrl, s3.endpoint, undefined, async (run) => {
          growthMeta = run.meta;
          await warmUp(run, scale);
          const small = await measureLatencySet(run, scale);
          figures.push(...growthRows(bigSet, small, { big: meta?.appliances ?? 0, small: run.meta.appliances }));
        });
      }
    }
  } finally {
    await s3.close();
    fs.rmSync(s3Dir, { recursive: true, force: true });
  }

  const m = meta as AppRun['meta'] | null;
  const g = growthMeta as AppRun['meta'] | null;
  const p = plan as Awaited<ReturnType<typeof explainDueQuery>> | null;
  const print = opts.print ?? ((text: string) => console.log(text));
  print(`\n${formatTable(figures)}\n  (${SHARED_CORES_NOTE}: ${os.cpus().length} cores${opts.quick ? '; --quick: too short for real numbers' : ''})\n`);
  if (p) print(`Due query plan:\n${p.text}\n`);
  const file = writeResults(opts.outDir, opts.crewOnly ? 'crew' : opts.importOnly ? 'import' : opts.bookingsOnly ? 'bookings' : opts.serviceLifeOnly ? 'service-life' : null, {
    date: new Date().toISOString(),
    quick: opts.quick,
    crewOnly: Boolean(opts.crewOnly),
    machine: { ...machineFacts(), note: SHARED_CORES_NOTE },
    database: { name: databaseNameOf(opts.databaseUrl), appliances: m?.appliances, seed: m?.seed, counts: m?.counts },
    growthDatabase: g ? { name: databaseNameOf(opts.growthDatabaseUrl!), appliances: g.appliances, counts: g.counts } : null,
    figures,
    duePlan: p,
  });
  return { figures, file };
}

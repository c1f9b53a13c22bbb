import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { generateBenchData } from '../../bench/data/generate';
import { databaseUrlOn } from '../../bench/lib/bench-db';
import type { BenchFigure } from '../../bench/lib/figure';
import { runBench } from '../../bench/server/run-bench';

// The benchmark's code paths on a tiny data set; no speed is asserted here (targets belong to `npm run bench`).
const SERVER_FIGURES = [
  'Timeline, first page of 50: p50',
  'Timeline, first page of 50: p97.5',
  'Timeline, first page of 50: p99',
  'Search by name or address prefix: p99',
  'Due in next 90 days, first page of 100: p99',
  'Stock counts, next 90 days',
  'Tag resolution (GET /api/public/tags/:code): p99',
  'Week board, 25 technicians: p99',
  'Round with its load list: p99',
  'Booking (insert with the no-clash check): p50',
  "Learned service life, one part type's fleet curve: p50",
  "Learned service life, one part type's fleet curve: p99",
  'Timeline throughput',
  'pgbench, the same timeline SQL',
  'Timeline throughput / pgbench',
  'Due query plan (EXPLAIN ANALYZE, first page)',
  'Concurrent technicians: draft save p99',
  'Concurrent technicians: errors',
  'Concurrent technicians: visits lost or duplicated',
  'Photo: 12 MP JPEG → display image + thumbnail, both stored',
  'Growth, timeline: p50 ratio',
  'Growth, search: p50 ratio',
  'Growth, due first page: p50 ratio',
  'Growth, stock counts: median ratio',
];

const DATABASE = 'lifeplate_bench_smoke';
const outDir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-bench-smoke-'));

afterAll(() => fs.rmSync(outDir, { recursive: true, force: true }));

describe('bench smoke (1,000 appliances, --quick)', () => {
  it('generates a seeded data set and produces every server figure with a number, written as JSON', async () => {
    const serverUrl = inject('databaseUrl');
    const meta = await generateBenchData({ serverUrl, database: DATABASE, appliances: 1000, seed: 7 });
    const databaseUrl = databaseUrlOn(serverUrl, DATABASE);
    let bookingsBefore = -1;

    const client = new pg.Client({ connectionString: databaseUrl });
    await client.connect();
    try {
      const { rows } = await client.query<{ appliances: number; events: number; due: number; tags: number; companies: number; bookings: number; clashes: number }>(`
        select (select count(*)::int from appliances where company_id = $1) as appliances,
               (select count(*)::int from timeline_events where company_id = $1) as events,
               (select count(*)::int from components where company_id = $1 and due_on is not null) as due,
               (select count(*)::int from tags where company_id = $1 and status = 'assigned') as tags,
               (select count(*)::int from companies) as companies,
               (select count(*)::int from bookings where company_id = $1) as bookings,
               (select count(*)::int from bookings a join bookings b on a.technician_id = b.technician_id and a.id < b.id
                  and tstzrange(a.starts_at, a.ends_at) && tstzrange(b.starts_at, b.ends_at)) as clashes`, [meta.companyId]);
      expect(rows[0].appliances).toBe(1000);
      expect(rows[0].companies).toBe(51);
      expect(rows[0].events).toBeGreaterThan(10_000);
      expect(rows[0].due).toBeGreaterThan(0);
      expect(rows[0].tags).toBeGreaterThan(900);
      // 25 technicians × 4 windows × the working days of 8 weeks either side (80 or 81 of them), none overlapping.
      expect(rows[0].bookings).toBeGreaterThanOrEqual(25 * 4 * 80);
      expect(rows[0].bookings).toBeLessThanOrEqual(25 * 4 * 81);
      expect(rows[0].clashes).toBe(0);
      bookingsBefore = rows[0].bookings;
    } finally {
      await client.end();
    }

    // The same database stands in for the smaller data set: the growth rows are exercised, not meaningful.
    const { figures, file } = await runBench({ databaseUrl, growthDatabaseUrl: databaseUrl, quick: true, client: false, outDir, log: () => {}, print: () => {} });

    const byName = new Map(figures.map((f) => [f.figure, f]));
    for (const name of SERVER_FIGURES) {
      const row = byName.get(name);
      expect(row, name).toBeDefined();
      expect(typeof row!.value, name).toBe('number');
      expect(Number.isFinite(row!.value), name).toBe(true);
    }
    // Correctness, not speed: the concurrent technicians lose and duplicate nothing and get no error.
    expect(byName.get('Concurrent technicians: errors')!.value).toBe(0);
    expect(byName.get('Concurrent technicians: visits lost or duplicated')!.value).toBe(0);
    // Every timed booking was created, and removed again so the data set stays as generated.
    expect(byName.get('Booking (insert with the no-clash check): p50')!.note).not.toMatch(/not created/);
    // The learned-life curve answered every request.
    expect(byName.get("Learned service life, one part type's fleet curve: p99")!.note).not.toMatch(/failed/);
    const after = new pg.Client({ connectionString: databaseUrl });
    await after.connect();
    try {
      const { rows } = await after.query<{ n: number }>('select count(*)::int as n from bookings where company_id = $1', [meta.companyId]);
      expect(rows[0].n).toBe(bookingsBefore);
    } finally {
      await after.end();
    }
    expect(path.dirname(file)).toBe(outDir);
    const written = JSON.parse(fs.readFileSync(file, 'utf8')) as { figures: BenchFigure[]; database: { appliances: number } };
    expect(written.figures.map((f) => f.figure)).toEqual(figures.map((f) => f.figure));
    expect(written.database.appliances).toBe(1000);
  }, 240_000);
});

import type { BenchMeta } from '../data/bench-meta';
import type { BenchFigure } from '../lib/figure';
import { getJson } from './boot';
import { endpoints, DUE_WINDOW_DAYS } from './endpoints';
import { runLoad, type LoadResult } from './load';
import { latencyAt, median, percentileRow, round, throughputSeconds, SHARED_CORES_NOTE, type Scale } from './measure';
import { runPgbench, timelinePgbenchScript } from './pgbench';
import type { Samples } from './samples';

export type AppRun = { baseUrl: string; cookie: string; databaseUrl: string; meta: BenchMeta; samples: Samples };
export type LatencySet = { timeline: LoadResult; search: LoadResult; due: LoadResult; stockMs: number[] };

/** Warms the caches and the JIT with the same mix the figures use, so the first figure does not pay for it. */
export async function warmUp(run: AppRun, scale: Scale) {
  const e = endpoints(run.samples);
  const mix = [e.timeline, e.timeline, e.search, e.tag, e.due];
  await runLoad({ baseUrl: run.baseUrl, cookie: run.cookie, paths: () => mix[Math.floor(Math.random() * mix.length)](), connections: 10, amount: scale.quick ? 50 : 1500, maxSeconds: 60 });
}

/** Timeline, search, due first page and stock counts: the figures compared between the two data set sizes. */
export async function measureLatencySet(run: AppRun, scale: Scale): Promise<LatencySet> {
  const e = endpoints(run.samples);
  const timeline = await latencyAt(scale, run.baseUrl, run.cookie, e.timeline, 100);
  const search = await latencyAt(scale, run.baseUrl, run.cookie, e.search, 50);
  const due = await latencyAt(scale, run.baseUrl, run.cookie, e.due, 20);
  const stockMs: number[] = [];
  for (let i = 0; i < (scale.quick ? 2 : 7); i++) {
    const start = performance.now();
    await getJson(run.baseUrl, e.stock(), run.cookie);
    stockMs.push(performance.now() - start);
  }
  return { timeline, search, due, stockMs };
}

export function latencyRows(set: LatencySet): BenchFigure[] {
  const t = set.timeline;
  const timelineLoad = '100 req/s, random appliance';
  return [
    { figure: 'Timeline, first page of 50: p50', load: timelineLoad, value: t.p50, unit: 'ms', target: '(reported)', met: null },
    { figure: 'Timeline, first page of 50: p97.5', load: timelineLoad, value: t.p975, unit: 'ms', target: '(reported)', met: null },
    percentileRow('Timeline, first page of 50: p99', timelineLoad, t, 50),
    percentileRow('Search by name or address prefix: p99', '50 req/s, random text', set.search, 50),
    percentileRow(`Due in next ${DUE_WINDOW_DAYS} days, first page of 100: p99`, '20 req/s', set.due, 100),
    {
      figure: `Stock counts, next ${DUE_WINDOW_DAYS} days`,
      load: 'one request at a time',
      value: round(median(set.stockMs), 1),
      unit: 'ms',
      target: '≤ 500 ms',
      met: median(set.stockMs) <= 500,
      note: `median of ${set.stockMs.length}; slowest ${round(Math.max(...set.stockMs), 1)} ms`,
    },
  ];
}

export async function tagRow(run: AppRun, scale: Scale): Promise<BenchFigure> {
  const r = await latencyAt(scale, run.baseUrl, run.cookie, endpoints(run.samples).tag, 100);
  return percentileRow('Tag resolution (GET /api/public/tags/:code): p99', '100 req/s, random tag', r, 20);
}

/** The app's timeline throughput at 50 connections beside pgbench running the same SQL with 50 clients. */
export async function throughputRows(run: AppRun, scale: Scale): Promise<BenchFigure[]> {
  const seconds = throughputSeconds(scale);
  const app = await runLoad({ baseUrl: run.baseUrl, cookie: run.cookie, paths: endpoints(run.samples).timeline, connections: 50, maxSeconds: seconds });
  const script = await timelinePgbenchScript(run.databaseUrl, {
    companyId: run.meta.companyId,
    seed: run.meta.seed,
    appliances: run.meta.appliances,
    sampleId: run.samples.applianceIds[0],
  });
  const tps = await runPgbench(run.databaseUrl, script, { clients: 50, seconds });
  const rate = round(app.ratePerSec, 0);
  return [
    {
      figure: 'Timeline throughput',
      load: `50 connections, ${seconds} s`,
      value: rate,
      unit: 'req/s',
      target: '≥ 600 req/s',
      met: app.failed === 0 && rate >= 600,
      note: [`p50 ${app.p50} ms, p99 ${app.p99} ms under saturation`, app.failed ? `${app.failed} failed` : '', SHARED_CORES_NOTE].filter(Boolean).join('; '),
    },
    { figure: 'pgbench, the same timeline SQL', load: `50 clients, ${seconds} s`, value: round(tps, 0), unit: 'tps', target: '(reported)', met: null, note: 'appliance check + first page, prepared statements, as the route sends them (no session lookup)' },
    { figure: 'Timeline throughput / pgbench', load: '50 concurrent', value: round(app.ratePerSec / tps, 2), unit: '', target: '≥ 0.25', met: app.ratePerSec / tps >= 0.25, note: 'what the app (HTTP, session, JSON) keeps of the database alone' },
  ];
}

export function growthRows(big: LatencySet, small: LatencySet, sizes: { big: number; small: number }): BenchFigure[] {
  const label = `${sizes.small / 1000}k → ${sizes.big / 1000}k appliances`;
  const row = (figure: string, a: LoadResult, b: LoadResult): BenchFigure => {
    const ratio = round(a.p50 / Math.max(b.p50, 0.5), 2);
    return { figure: `Growth, ${figure}: p50 ratio`, load: label, value: ratio, unit: '×', target: '≤ 1.5×', met: ratio <= 1.5, note: `p50 ${b.p50} → ${a.p50} ms; p99 ${b.p99} → ${a.p99} ms` };
  };
  const stockRatio = round(median(big.stockMs) / Math.max(median(small.stockMs), 0.5), 2);
  return [
    row('timeline', big.timeline, small.timeline),
    row('search', big.search, small.search),
    row('due first page', big.due, small.due),
    {
      figure: 'Growth, stock counts: median ratio',
      load: label,
      value: stockRatio,
      unit: '×',
      target: '(exempt: counts grow with the data)',
      met: null,
      note: `median ${round(median(small.stockMs), 1)} → ${round(median(big.stockMs), 1)} ms`,
    },
  ];
}

import type { BenchFigure } from '../lib/figure';
import { runLoad, type LoadResult } from './load';

export type Scale = { quick: boolean };
/** Seconds of steady load per latency figure; quick mode is for the smoke test, not for numbers. */
export const latencySeconds = (s: Scale) => (s.quick ? 1 : 20);
export const throughputSeconds = (s: Scale) => (s.quick ? 2 : 15);

export const SHARED_CORES_NOTE = 'app, PostgreSQL and the load tool share the same cores';

/** Latency at a fixed request rate, so queueing does not dominate; at most `rate × seconds` requests. */
export function latencyAt(scale: Scale, baseUrl: string, cookie: string, paths: () => string, rate: number) {
  const seconds = latencySeconds(scale);
  return runLoad({ baseUrl, cookie, paths, connections: Math.max(2, Math.ceil(rate / 10)), overallRate: rate, amount: rate * seconds, maxSeconds: seconds * 3 + 10 });
}

export function failedNote(r: LoadResult) {
  return r.failed ? `${r.failed} of ${r.total} requests failed or answered non-2xx` : '';
}

export function percentileRow(figure: string, load: string, r: LoadResult, targetMs: number, extraNote = ''): BenchFigure {
  const note = [`p50 ${r.p50} ms, p97.5 ${r.p975} ms over ${r.total} requests`, failedNote(r), extraNote].filter(Boolean).join('; ');
  return { figure, load, value: r.p99, unit: 'ms', target: `p99 ≤ ${targetMs} ms`, met: r.failed ? false : r.p99 <= targetMs, note };
}

export function median(values: number[]) {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

export const round = (v: number, digits = 2) => Number(v.toFixed(digits));

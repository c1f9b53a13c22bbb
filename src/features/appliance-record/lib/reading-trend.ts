import type { TimelineEventDto } from '@shared/schemas/records';

export type TrendPoint = { at: string; efficiencyPct: number | null; coAirFreePpm: number | null; flueTempF: number | null };

function numberAt(data: unknown, path: string[]): number | null {
  let v: unknown = data;
  for (const key of path) {
    if (v === null || typeof v !== 'object') return null;
    v = (v as Record<string, unknown>)[key];
  }
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
}

const first = (data: unknown, paths: string[][]) => paths.reduce<number | null>((found, p) => found ?? numberAt(data, p), null);

/** Reading events carry the server's stored readings and results; each number is looked for where the visit keeps it. */
export function trendPoint(e: TimelineEventDto): TrendPoint {
  const d = e.data;
  return {
    at: e.occurredAt,
    efficiencyPct: first(d, [['results', 'combustion', 'efficiencyPct'], ['combustion', 'efficiencyPct'], ['efficiencyPct']]),
    coAirFreePpm: first(d, [['results', 'combustion', 'coAirFreePpm'], ['combustion', 'coAirFreePpm'], ['coAirFreePpm']]),
    flueTempF: first(d, [['readings', 'combustion', 'flueTempF'], ['combustion', 'flueTempF'], ['flueTempF']]),
  };
}

/** Oldest first, only events that hold at least one of the three numbers. */
export function trendPoints(events: TimelineEventDto[]): TrendPoint[] {
  return events
    .filter((e) => e.kind === 'reading')
    .map(trendPoint)
    .filter((p) => p.efficiencyPct != null || p.coAirFreePpm != null || p.flueTempF != null)
    .sort((a, b) => a.at.localeCompare(b.at));
}

import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { BenchFigure } from '../lib/figure';

const fmt = (v: number | null, unit: string) => (v === null ? 'n/a' : `${Number.isInteger(v) ? v : v.toFixed(v < 10 ? 2 : 1)} ${unit}`.trim());
const met = (m: boolean | null) => (m === null ? 'reported' : m ? 'met' : 'NOT met');

export function formatTable(figures: BenchFigure[]): string {
  const rows = [['figure', 'load', 'value', 'target', 'met'], ...figures.map((f) => [f.figure, f.load, fmt(f.value, f.unit), f.target, met(f.met)])];
  const widths = rows[0].map((_, i) => Math.max(...rows.map((r) => r[i].length)));
  const line = (r: string[]) => r.map((c, i) => c.padEnd(widths[i])).join(' | ');
  const notes = figures.filter((f) => f.note).map((f) => `  - ${f.figure}: ${f.note}`);
  return [line(rows[0]), widths.map((w) => '-'.repeat(w)).join('-|-'), ...rows.slice(1).map(line), '', 'Notes:', ...notes].join('\n');
}

export function machineFacts() {
  return { cpus: os.cpus().length, cpuModel: os.cpus()[0]?.model ?? 'unknown', memoryGb: Math.round(os.totalmem() / 2 ** 30), node: process.version, platform: `${os.platform()} ${os.release()}` };
}

/** `<date>.json`, or `<date>-<suffix>.json` for a partial run. */
export function writeResults(outDir: string, suffix: string | null, data: Record<string, unknown>): string {
  fs.mkdirSync(outDir, { recursive: true });
  const file = path.join(outDir, `${new Date().toISOString().slice(0, 10)}${suffix ? `-${suffix}` : ''}.json`);
  fs.writeFileSync(file, `${JSON.stringify(data, null, 2)}\n`);
  return file;
}

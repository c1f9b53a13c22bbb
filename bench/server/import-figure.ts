import { execFile } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import type { BenchFigure } from '../lib/figure';
import type { ImportSummary } from '../../shared/schemas/imports';
import { round, SHARED_CORES_NOTE, type Scale } from './measure';

export const IMPORT_ROWS = 10_000;
const CHILD = path.join(path.dirname(fileURLToPath(import.meta.url)), 'import-child.ts');

type ChildResult = { outcome: string; seconds: number; megabytes: number; rssBeforeMb: number; peakRssMb: number; summary: ImportSummary | null };

/**
 * A new company brings 10,000 appliance rows in (two parts and two past visits each) through the service the
 * upload and run routes call, in a process of its own (import-child.ts) that holds the app and nothing else, so its
 * peak resident memory (VmHWM) is the app's. The company is removed afterwards.
 */
export async function importRows(opts: { databaseUrl: string; s3Endpoint: string; s3Bucket: string }, scale: Scale, log: (line: string) => void): Promise<BenchFigure[]> {
  const rows = scale.quick ? 300 : IMPORT_ROWS;
  log(`Importing ${rows} rows in a process of its own…`);
  const { stdout } = await promisify(execFile)(process.execPath, [...(process.env.IMPORT_CHILD_HEAP_MB ? [`--max-old-space-size=${process.env.IMPORT_CHILD_HEAP_MB}`] : []), '--import', 'tsx', CHILD, JSON.stringify({ ...opts, rows })], { maxBuffer: 1 << 20, timeout: 15 * 60_000 });
  const r = JSON.parse(stdout.trim().split('\n').at(-1)!) as ChildResult;
  if (r.outcome !== 'done' || r.summary?.appliances.create !== rows) throw new Error(`The bench import did not finish as expected: ${stdout}`);
  return [
    {
      figure: `Import: ${rows.toLocaleString('en-US')} appliance rows with parts and two past visits each`,
      load: 'one file',
      value: round(r.seconds, 1),
      unit: 's',
      target: '≤ 60 s',
      met: scale.quick ? null : r.seconds <= 60,
      note: `${(r.megabytes).toFixed(1)} MB of CSV; ${r.summary.customers.create} customers, ${r.summary.appliances.create} appliances, ${r.summary.parts.create} parts, ${r.summary.visits.create} visits; ${SHARED_CORES_NOTE}`,
    },
    {
      figure: 'Import: peak resident memory of the app process',
      load: `${rows.toLocaleString('en-US')} rows`,
      value: round(r.peakRssMb, 0),
      unit: 'MB',
      target: '< 300 MB',
      met: scale.quick ? null : r.peakRssMb < 300,
      note: `VmHWM of a process holding only the app (booted, ${round(r.rssBeforeMb, 0)} MB before the upload) and the import`,
    },
  ];
}

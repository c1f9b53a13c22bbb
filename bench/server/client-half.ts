import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { BenchFigure } from '../lib/figure';
import type { AppRun } from './app-figures';
import type { Scale } from './measure';

type ClientHalf = {
  measureClientFigures(opts: { baseUrl: string; cookie: string; shareUrl: string; recordUrl: string; quick: boolean }): Promise<BenchFigure[]>;
};

const CLIENT_INDEX = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../client/index.ts');

/** The client half (bundle sizes, cold-load timings) lives in bench/client; it runs only when it is there. */
export async function measureClientHalf(run: AppRun, scale: Scale, log: (line: string) => void): Promise<BenchFigure[]> {
  if (!fs.existsSync(CLIENT_INDEX)) {
    log('No bench/client/index.ts: skipping the client half.');
    return [];
  }
  const applianceId = run.samples.applianceIds[0];
  const res = await fetch(`${run.baseUrl}/api/appliances/${applianceId}/share-links`, {
    method: 'POST',
    headers: { cookie: run.cookie, 'content-type': 'application/json', origin: run.baseUrl },
    body: JSON.stringify({ expiresInDays: 30, label: 'Bench' }),
  });
  if (!res.ok) throw new Error(`Creating a share link answered ${res.status}: ${await res.text()}`);
  const { url: shareUrl } = (await res.json()) as { url: string };
  log('Client half (bench/client)…');
  const client = (await import(CLIENT_INDEX)) as ClientHalf;
  return client.measureClientFigures({ baseUrl: run.baseUrl, cookie: run.cookie, shareUrl, recordUrl: `${run.baseUrl}/appliances/${applianceId}`, quick: scale.quick });
}

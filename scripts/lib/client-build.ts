import fs from 'node:fs';
import path from 'node:path';
import { build } from 'vite';
import { PROJECT_ROOT } from './paths';

function newestMtime(entry: string): number {
  const stat = fs.statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return Math.max(stat.mtimeMs, ...fs.readdirSync(entry).map((e) => newestMtime(path.join(entry, e))));
}

/** Builds the client into outDir unless a build newer than every client source is already there. */
export async function buildClientIfStale(outDir: string, { quiet = false } = {}) {
  const index = path.join(outDir, 'index.html');
  const sources = ['src', 'shared', 'index.html', 'vite.config.ts', 'tailwind.config.ts', 'public'].map((p) => path.join(PROJECT_ROOT, p));
  const newestSource = Math.max(...sources.filter((s) => fs.existsSync(s)).map(newestMtime));
  if (fs.existsSync(index) && fs.statSync(index).mtimeMs >= newestSource) return { built: false };
  if (!quiet) console.log('Building the client…');
  await build({ root: PROJECT_ROOT, logLevel: quiet ? 'silent' : 'warn', build: { outDir, emptyOutDir: true } });
  return { built: true };
}

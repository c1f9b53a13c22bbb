import fs from 'node:fs';
import path from 'node:path';
import { execFileSync } from 'node:child_process';
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
  // A child process with NODE_ENV=production: inside a test run NODE_ENV is 'test', which would make a dev bundle.
  execFileSync(path.join(PROJECT_ROOT, 'node_modules', '.bin', 'vite'), ['build', '--outDir', outDir, '--emptyOutDir', '--logLevel', quiet ? 'error' : 'warn'], {
    cwd: PROJECT_ROOT,
    stdio: quiet ? 'pipe' : 'inherit',
    env: { ...process.env, NODE_ENV: 'production' },
  });
  return { built: true };
}

import fs from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import type { BenchFigure } from '../lib/figure';
import { CLIENT_ROUTES, OFFICE_SCREENS } from '../../server/spa/route-chunks';
import { chunkClosure, ENTRY_KEY, readManifest, type ViteManifest } from '../../server/spa/manifest';

/** Gzip budgets (KB) for what a route loads: the entry, the vendor chunk and its lazy chunks with their static imports. */
// A signed-in page carries the offline store and the outbox with its shell (about 6 KB gzip), so the homeowner's
// signed-in page has 10 KB more than the anonymous tag and share pages.
export const BUNDLE_BUDGETS_KB: Record<string, number> = { tag: 130, share: 130, 'my-appliance': 140, record: 200 };

export type RouteBundle = {
  route: string;
  path: string;
  jsFiles: string[];
  jsGzipBytes: number;
  cssGzipBytes: number;
  /** With the sections that load after the first screen has painted (null when the route defers none). */
  withDeferredJsGzipBytes: number | null;
};

const KB = 1024;
// Level 6 is zlib's default, which is what the compression middleware sends.
const gzipBytes = (clientDir: string, file: string) => gzipSync(fs.readFileSync(path.join(clientDir, file)), { level: 6 }).length;

export function loadManifest(clientDir: string): ViteManifest {
  const manifest = readManifest(clientDir);
  if (!manifest) throw new Error(`No .vite/manifest.json in ${clientDir}: build the client with build.manifest on (vite.config.ts).`);
  return manifest;
}

export function measureRouteBundles(clientDir: string): RouteBundle[] {
  const manifest = loadManifest(clientDir);
  return CLIENT_ROUTES.map((route) => {
    const { js, css } = chunkClosure(manifest, [ENTRY_KEY, ...route.modules]);
    const withDeferred = route.deferred?.length ? chunkClosure(manifest, [ENTRY_KEY, ...route.modules, ...route.deferred]).js : null;
    return {
      withDeferredJsGzipBytes: withDeferred ? withDeferred.reduce((sum, f) => sum + gzipBytes(clientDir, f), 0) : null,
      route: route.name,
      path: route.path,
      jsFiles: js,
      jsGzipBytes: js.reduce((sum, f) => sum + gzipBytes(clientDir, f), 0),
      cssGzipBytes: css.reduce((sum, f) => sum + gzipBytes(clientDir, f), 0),
    };
  });
}

/** Each office screen is a dynamic entry whose own file the entry's closure does not contain. */
export function officeScreensOutsideEntry(clientDir: string): { split: string[]; notSplit: string[] } {
  const manifest = loadManifest(clientDir);
  const entryFiles = new Set(chunkClosure(manifest, [ENTRY_KEY]).js);
  const split: string[] = [];
  const notSplit: string[] = [];
  for (const key of OFFICE_SCREENS) {
    const chunk = manifest[key];
    (chunk?.isDynamicEntry && !entryFiles.has(chunk.file) ? split : notSplit).push(key);
  }
  return { split, notSplit };
}

const kb = (bytes: number) => Math.round((bytes / KB) * 10) / 10;

export function bundleFigures(clientDir: string): BenchFigure[] {
  const rows: BenchFigure[] = measureRouteBundles(clientDir)
    .filter((b) => b.route in BUNDLE_BUDGETS_KB)
    .flatMap((b) => {
      const budget = BUNDLE_BUDGETS_KB[b.route];
      const total = b.jsGzipBytes + b.cssGzipBytes;
      return [
        {
          figure: `Client JS, gzip: ${b.path}`,
          load: `entry + vendor + route chunks (${b.jsFiles.length} files)`,
          value: kb(b.jsGzipBytes),
          unit: 'KB',
          target: `≤ ${budget} KB`,
          met: b.jsGzipBytes <= budget * KB,
        },
        { figure: `Client CSS, gzip: ${b.path}`, load: 'stylesheets of those chunks', value: kb(b.cssGzipBytes), unit: 'KB', target: 'reported', met: null },
        { figure: `Client JS + CSS, gzip: ${b.path}`, load: 'total', value: kb(total), unit: 'KB', target: 'reported', met: null },
        ...(b.withDeferredJsGzipBytes === null
          ? []
          : [
              {
                figure: `Client JS, gzip: ${b.path} with deferred sections`,
                load: 'plus the sections loaded after the first screen paints',
                value: kb(b.withDeferredJsGzipBytes),
                unit: 'KB',
                target: 'reported',
                met: null,
              },
            ]),
      ];
    });
  const office = officeScreensOutsideEntry(clientDir);
  rows.push({
    figure: 'Office screens in their own chunks',
    load: `${OFFICE_SCREENS.length} screens`,
    value: office.split.length,
    unit: `of ${OFFICE_SCREENS.length}`,
    target: `${OFFICE_SCREENS.length} of ${OFFICE_SCREENS.length}`,
    met: office.notSplit.length === 0,
    ...(office.notSplit.length ? { note: `in the entry: ${office.notSplit.join(', ')}` } : {}),
  });
  return rows;
}

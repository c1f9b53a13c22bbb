import fs from 'node:fs';
import path from 'node:path';
import { chunkClosure, ENTRY_KEY, readManifest, type ViteManifest } from './manifest';
import type { ClientRoute } from './route-chunks';

// Source Sans 3, Latin subset: 700 for the page's heading (usually the largest text on the first screen), 400 for the rest.
const ABOVE_THE_FOLD_FONTS = [
  'node_modules/@fontsource/source-sans-3/files/source-sans-3-latin-700-normal.woff2',
  'node_modules/@fontsource/source-sans-3/files/source-sans-3-latin-400-normal.woff2',
];

/** The built index.html with, per route, modulepreload links for its lazy chunks and the embedded first-screen data. */
export function indexHtmlRenderer(clientDir: string) {
  const template = fs.readFileSync(path.join(clientDir, 'index.html'), 'utf8');
  const manifest: ViteManifest | null = readManifest(clientDir);
  const entryFiles = new Set(manifest?.[ENTRY_KEY] ? chunkClosure(manifest, [ENTRY_KEY]).js : []);
  const fontLinks = manifest
    ? ABOVE_THE_FOLD_FONTS.filter((key) => manifest[key])
        .map((key) => `<link rel="preload" href="/${manifest[key].file}" as="font" type="font/woff2" crossorigin>`)
        .join('')
    : '';
  const headFor = new Map<string, string>();

  function routeHead(route: ClientRoute | null): string {
    if (!manifest || !route) return fontLinks;
    const cached = headFor.get(route.name);
    if (cached !== undefined) return cached;
    let links = '';
    try {
      links = chunkClosure(manifest, route.modules)
        .js.filter((file) => !entryFiles.has(file))
        .map((file) => `<link rel="modulepreload" crossorigin href="/${file}">`)
        .join('');
    } catch {
      // A build older than the route table: serve the page without hints rather than fail it.
    }
    headFor.set(route.name, fontLinks + links);
    return fontLinks + links;
  }

  return (route: ClientRoute | null, bodyData = ''): string =>
    template.replace('</head>', `${routeHead(route)}</head>`).replace('<div id="root"></div>', `<div id="root"></div>${bodyData}`);
}

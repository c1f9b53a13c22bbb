import fs from 'node:fs';
import path from 'node:path';
import { chunkClosure, ENTRY_KEY, readManifest, type ViteManifest } from './manifest';
import type { ClientRoute } from './route-chunks';

// Source Sans 3, Latin subset: 700 for the page's heading (usually the largest text on the first screen), 400 for the rest.
const ABOVE_THE_FOLD_FONTS = [
  'node_modules/@fontsource/source-sans-3/files/source-sans-3-latin-700-normal.woff2',
  'node_modules/@fontsource/source-sans-3/files/source-sans-3-latin-400-normal.woff2',
];

type Build = { mtimeMs: number; template: string; manifest: ViteManifest | null; entryFiles: Set<string>; fontLinks: string; headFor: Map<string, string> };

function loadBuild(clientDir: string, mtimeMs: number): Build {
  const template = fs.readFileSync(path.join(clientDir, 'index.html'), 'utf8');
  const manifest = readManifest(clientDir);
  const fontLinks = manifest
    ? ABOVE_THE_FOLD_FONTS.filter((key) => manifest[key])
        .map((key) => `<link rel="preload" href="/${manifest[key].file}" as="font" type="font/woff2" crossorigin>`)
        .join('')
    : '';
  const entryFiles = new Set(manifest?.[ENTRY_KEY] ? chunkClosure(manifest, [ENTRY_KEY]).js : []);
  return { mtimeMs, template, manifest, entryFiles, fontLinks, headFor: new Map() };
}

function routeHead(build: Build, route: ClientRoute | null): string {
  if (!build.manifest || !route) return build.fontLinks;
  const cached = build.headFor.get(route.name);
  if (cached !== undefined) return cached;
  let links = '';
  try {
    links = chunkClosure(build.manifest, route.modules)
      .js.filter((file) => !build.entryFiles.has(file))
      .map((file) => `<link rel="modulepreload" crossorigin href="/${file}">`)
      .join('');
  } catch {
    // A build older than the route table: serve the page without hints rather than fail it.
  }
  build.headFor.set(route.name, build.fontLinks + links);
  return build.fontLinks + links;
}

/**
 * The built index.html with, per route, modulepreload links for its lazy chunks, the embedded first-screen data and,
 * where the server rendered it, the first screen's markup inside the root element.
 * Read again when index.html changes, so a rebuild under a running server never serves links to deleted chunks.
 */
export function indexHtmlRenderer(clientDir: string) {
  const indexFile = path.join(clientDir, 'index.html');
  let build = loadBuild(clientDir, fs.statSync(indexFile).mtimeMs);
  return (route: ClientRoute | null, bodyData = '', rootMarkup = ''): string => {
    // Mid-rebuild the file may be missing for a moment: keep the build we have until a complete one is there.
    const mtimeMs = fs.existsSync(indexFile) ? fs.statSync(indexFile).mtimeMs : build.mtimeMs;
    if (mtimeMs !== build.mtimeMs) {
      try {
        build = loadBuild(clientDir, mtimeMs);
      } catch {
        // Half-written: the next request tries again.
      }
    }
    // Replacer functions: the markup and data hold user text, where `$&` or `$'` must stay literal.
    return build.template
      .replace('</head>', () => `${routeHead(build, route)}</head>`)
      .replace('<div id="root"></div>', () => `<div id="root">${rootMarkup}</div>${bodyData}`);
  };
}

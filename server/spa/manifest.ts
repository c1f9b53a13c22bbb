import fs from 'node:fs';
import path from 'node:path';

/** One entry of Vite's .vite/manifest.json (only the fields we read). */
export type ManifestChunk = { file: string; src?: string; isEntry?: boolean; isDynamicEntry?: boolean; imports?: string[]; dynamicImports?: string[]; css?: string[] };
export type ViteManifest = Record<string, ManifestChunk>;

export const ENTRY_KEY = 'index.html';

export function readManifest(clientDir: string): ViteManifest | null {
  const file = path.join(clientDir, '.vite', 'manifest.json');
  return fs.existsSync(file) ? (JSON.parse(fs.readFileSync(file, 'utf8')) as ViteManifest) : null;
}

/** The JS files (and CSS) that loading these manifest keys brings in: each chunk and, recursively, its static imports. */
export function chunkClosure(manifest: ViteManifest, keys: readonly string[]): { js: string[]; css: string[] } {
  const js = new Set<string>();
  const css = new Set<string>();
  const seen = new Set<string>();
  const visit = (key: string) => {
    if (seen.has(key)) return;
    seen.add(key);
    const chunk = manifest[key];
    if (!chunk) throw new Error(`${key} is not in the client build manifest: is server/spa/route-chunks.ts in step with src/app/router.tsx?`);
    if (chunk.file.endsWith('.js')) js.add(chunk.file);
    chunk.css?.forEach((c) => css.add(c));
    chunk.imports?.forEach(visit);
  };
  keys.forEach(visit);
  return { js: [...js], css: [...css] };
}

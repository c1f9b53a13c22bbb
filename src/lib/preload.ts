import type { QueryClient } from '@tanstack/react-query';

/** Matches server/spa/preload.ts: the first screen's data the server embedded in the HTML, keyed by query key. */
type Preload = { queries: { key: readonly unknown[]; data: unknown }[] };

let preload: Preload | null | undefined;

/** Read once per page load (a second query client, as StrictMode makes, gets the same data). */
function readPreload(): Preload | null {
  if (preload !== undefined) return preload;
  const text = typeof document === 'undefined' ? null : document.getElementById('lp-preload')?.textContent;
  try {
    const parsed: unknown = text ? JSON.parse(text) : null;
    preload = parsed && typeof parsed === 'object' && Array.isArray((parsed as Preload).queries) ? (parsed as Preload) : null;
  } catch {
    preload = null;
  }
  return preload;
}

/** Seeds the cache so the first screen renders without waiting for the API; it refreshes as usual once stale. */
export function seedPreloadedQueries(queryClient: QueryClient) {
  for (const { key, data } of readPreload()?.queries ?? []) {
    if (Array.isArray(key) && data !== undefined) queryClient.setQueryData(key, data);
  }
}

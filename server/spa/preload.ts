/**
 * The first screen's data, embedded in the HTML so the page needs no API round trip before it can paint.
 * Keys are the TanStack Query keys the client features use (tests/unit/preload-keys.test.ts holds them equal).
 */
export type PreloadedQuery = { key: readonly unknown[]; data: unknown };

export const preloadKeys = {
  me: () => ['me'] as const,
  share: (token: string) => ['share', token] as const,
  applianceRecord: (id: string) => ['appliance', id] as const,
};

export const PRELOAD_ELEMENT_ID = 'lp-preload';

/**
 * A `<script type="application/json">` holds data, never runs (so the CSP allows it). Every `<` is escaped so no
 * text in the data can close the element or open a comment.
 */
export function preloadScriptTag(queries: PreloadedQuery[]): string {
  if (!queries.length) return '';
  const json = JSON.stringify({ queries }).replace(/</g, '\\u003c').replace(/\u2028/g, '\\u2028').replace(/\u2029/g, '\\u2029');
  return `<script type="application/json" id="${PRELOAD_ELEMENT_ID}">${json}</script>`;
}

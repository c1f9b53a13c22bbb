import type { Query, QueryKey } from '@tanstack/react-query';

/** How long saved data may be shown without signal: a long weekend's round. Older data is dropped, not shown. */
export const SAVED_MAX_AGE_MS = 3 * 24 * 60 * 60 * 1000;
/** Records opened during the day are kept too, up to this many; the least recently loaded are dropped first. */
export const MAX_SAVED_RECORDS = 200;

/*
 * What the technician needs in a basement: who is signed in, the round, each appliance's record and timeline, the
 * visits, and the catalog and checklist templates a new visit or a part swap reads. Office lists stay online-only.
 */
export const SAVED_PREFIXES: ReadonlyArray<QueryKey> = [['me'], ['appliance'], ['visit'], ['bookings', 'round'], ['catalog', 'component-types'], ['checklist-templates']];

export const isSavedForOffline = (key: QueryKey) => SAVED_PREFIXES.some((prefix) => prefix.every((part, i) => key[i] === part));

export const shouldSaveQuery = (query: Query) => query.state.status === 'success' && isSavedForOffline(query.queryKey);

/** The appliance ids whose saved queries should go: beyond the bound, least recently loaded first, none on screen. */
export function recordsBeyondBound(queries: Query[], bound = MAX_SAVED_RECORDS): string[] {
  const newest = new Map<string, { at: number; onScreen: boolean }>();
  for (const q of queries) {
    if (q.queryKey[0] !== 'appliance' || typeof q.queryKey[1] !== 'string') continue;
    const id = q.queryKey[1];
    const seen = newest.get(id) ?? { at: 0, onScreen: false };
    newest.set(id, { at: Math.max(seen.at, q.state.dataUpdatedAt), onScreen: seen.onScreen || q.getObserversCount() > 0 });
  }
  if (newest.size <= bound) return [];
  const oldestFirst = [...newest.entries()].filter(([, v]) => !v.onScreen).sort((a, b) => a[1].at - b[1].at);
  return oldestFirst.slice(0, newest.size - bound).map(([id]) => id);
}

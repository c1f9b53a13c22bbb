import type { QueryClient } from '@tanstack/react-query';
import { persistQueryClientRestore, persistQueryClientSave, type PersistedClient, type Persister } from '@tanstack/react-query-persist-client';
import { del, get, set } from 'idb-keyval';
import { SAVED_MAX_AGE_MS, SAVED_PREFIXES, isSavedForOffline, recordsBeyondBound, shouldSaveQuery } from './saved-queries';
import { userStores } from './user-stores';

/** Bumped when a saved answer's shape changes in a way the screens cannot read: older saves are then dropped. */
const BUSTER = 'lifeplate-1';
const SAVE_AFTER_MS = 1000;
const KEY = 'query-cache';

function idbPersister(userId: string): Persister {
  const { cache } = userStores(userId);
  return {
    persistClient: (client: PersistedClient) => set(KEY, client, cache),
    restoreClient: () => get<PersistedClient>(KEY, cache),
    removeClient: () => del(KEY, cache),
  };
}

/** Saved queries must outlive TanStack Query's five-minute clean-up of unused ones, or they would vanish from the save. */
export function keepSavedQueriesInMemory(queryClient: QueryClient) {
  for (const queryKey of SAVED_PREFIXES) queryClient.setQueryDefaults(queryKey, { gcTime: SAVED_MAX_AGE_MS });
}

/** Puts what this person's phone saved back into the cache; a read that fails leaves the cache empty, never broken. */
export async function restoreSavedQueries(queryClient: QueryClient, userId: string) {
  try {
    await persistQueryClientRestore({ queryClient, persister: idbPersister(userId), maxAge: SAVED_MAX_AGE_MS, buster: BUSTER });
    // Saved answers are shown at once but asked for again as each screen opens with signal, whatever their staleTime
    // (a visit's is Infinity): the server may have moved on since they were saved.
    await queryClient.invalidateQueries({ refetchType: 'none' });
  } catch {
    // persistQueryClientRestore has already removed an unreadable save; the app simply loads from the server.
  }
}

/** Saves the offline queries a second after the cache changes (one write for a burst of answers). Returns a stop. */
export function keepQueriesSaved(queryClient: QueryClient, userId: string): () => void {
  const persister = idbPersister(userId);
  let timer: ReturnType<typeof setTimeout> | undefined;
  const save = () => {
    timer = undefined;
    const cache = queryClient.getQueryCache();
    for (const id of recordsBeyondBound(cache.getAll())) queryClient.removeQueries({ queryKey: ['appliance', id] });
    void persistQueryClientSave({ queryClient, persister, buster: BUSTER, dehydrateOptions: { shouldDehydrateQuery: shouldSaveQuery, shouldDehydrateMutation: () => false } });
  };
  const unsubscribe = queryClient.getQueryCache().subscribe((event) => {
    if ((event.type === 'added' || event.type === 'removed' || event.type === 'updated') && isSavedForOffline(event.query.queryKey)) {
      timer ??= setTimeout(save, SAVE_AFTER_MS);
    }
  });
  // Leaving the page (a link out, a reload, the phone locking) must not lose the last second's answers.
  const flush = () => {
    if (!timer) return;
    clearTimeout(timer);
    save();
  };
  const onHidden = () => document.visibilityState === 'hidden' && flush();
  window.addEventListener('pagehide', flush);
  document.addEventListener('visibilitychange', onHidden);
  return () => {
    unsubscribe();
    window.removeEventListener('pagehide', flush);
    document.removeEventListener('visibilitychange', onHidden);
    flush();
  };
}

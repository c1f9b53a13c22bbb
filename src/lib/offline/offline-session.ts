import { useSyncExternalStore } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { keepQueriesSaved, restoreSavedQueries } from './cache-persistence';
import { Outbox, type OutboxHandlers, type OutboxSnapshot } from './outbox';
import { forgetSignedInUser, lastSignedInUser, rememberSignedInUser, userStores } from './user-stores';

/*
 * One signed-in person's offline data at a time: their saved queries and their outbox. Opened before the first render
 * for whoever used the phone last (so a reload in a basement shows the round), confirmed or switched once the server
 * says who is signed in, and wiped on sign-out.
 */

type Session = { userId: string; outbox: Outbox; stopSaving: (() => void) | null };

let session: Session | null = null;
const listeners = new Set<() => void>();
const emit = () => listeners.forEach((l) => l());

const NO_OUTBOX: OutboxSnapshot = { entries: [], sending: false, nextTryAt: null };

async function open(queryClient: QueryClient, userId: string) {
  const outbox = new Outbox(userId, userStores(userId).outbox);
  session = { userId, outbox, stopSaving: null };
  await Promise.all([restoreSavedQueries(queryClient, userId), outbox.load()]);
  emit();
}

/** Before the first render: the last person's saved data, if any; gives up after a moment rather than hold the screen. */
export async function openLastSession(queryClient: QueryClient, timeoutMs = 1500) {
  const userId = lastSignedInUser();
  if (!userId || typeof indexedDB === 'undefined') return;
  await Promise.race([open(queryClient, userId), new Promise((resolve) => setTimeout(resolve, timeoutMs))]);
}

/** The server says who is signed in: keep saving for them, or, for someone else, put the last person's data away. */
export async function confirmSession(queryClient: QueryClient, userId: string, handlers: OutboxHandlers) {
  if (session && session.userId !== userId) {
    stopSession();
    // Nothing of the last person's stays on screen for the next one.
    queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'me' });
    session = null;
  }
  if (!session) await open(queryClient, userId);
  const s = session!;
  rememberSignedInUser(userId);
  s.outbox.setHandlers(handlers);
  s.stopSaving ??= keepQueriesSaved(queryClient, userId);
  s.outbox.start();
  emit();
}

function stopSession() {
  session?.stopSaving?.();
  session?.outbox.stop();
  if (session) session.stopSaving = null;
}

/** Sign-out: stop saving first (a late save would write the data back), then wipe this person's stores and drafts. */
export async function endSession() {
  const s = session;
  stopSession();
  session = null;
  emit();
  if (s) await forgetSignedInUser(s.userId);
}

export const currentOutbox = () => session?.outbox ?? null;

/** What is waiting to send for the signed-in person (re-subscribes when the session changes). */
export function useOutbox(): { outbox: Outbox | null; snapshot: OutboxSnapshot } {
  const outbox = useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    currentOutbox,
  );
  const snapshot = useSyncExternalStore(
    (l) => outbox?.subscribe(l) ?? (() => undefined),
    () => outbox?.getSnapshot() ?? NO_OUTBOX,
  );
  return { outbox, snapshot };
}


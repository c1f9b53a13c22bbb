import { onlineManager } from '@tanstack/react-query';

/*
 * Whether the server can be reached, as the screens and TanStack Query see it. The browser's `navigator.onLine` says
 * only that some network is there: one bar in a basement, or a page the service worker served because the server
 * could not be reached, both report "online". So a request that cannot reach the server marks the app offline (queries
 * pause, the screens say "No signal"), and a small probe of /api/health marks it online again once an answer comes.
 */

const PROBE_EVERY_MS = 10_000;
let probe: ReturnType<typeof setInterval> | undefined;

async function probeOnce() {
  try {
    await fetch('/api/health', { cache: 'no-store', credentials: 'omit' });
    noteServerReached();
  } catch {
    // Still no signal: the next probe tries again.
  }
}

export function noteNoSignal() {
  if (onlineManager.isOnline()) onlineManager.setOnline(false);
  probe ??= setInterval(() => void probeOnce(), PROBE_EVERY_MS);
}

export function noteServerReached() {
  if (probe) {
    clearInterval(probe);
    probe = undefined;
  }
  if (!onlineManager.isOnline()) onlineManager.setOnline(true);
}

/** At start: a page the service worker served from its precache (it marks the root) was opened with no signal. */
export function readNetworkAtStart() {
  const servedOffline = typeof document !== 'undefined' && document.getElementById('root')?.hasAttribute('data-served-offline');
  if (servedOffline || (typeof navigator !== 'undefined' && navigator.onLine === false)) noteNoSignal();
}

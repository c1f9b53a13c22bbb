/// <reference lib="webworker" />
import { cleanupOutdatedCaches, matchPrecache, precacheAndRoute } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';
import { NetworkOnly } from 'workbox-strategies';

declare const self: ServiceWorkerGlobalScope & { __WB_MANIFEST: Array<{ url: string; revision: string | null }> };

/*
 * The app shell only: the built client is precached so the signed-in screens open with no network. API answers are
 * never put in Cache Storage (they would outlive a sign-out and reach the next person on the phone); data lives in
 * the signed-in person's own IndexedDB store (src/lib/offline).
 */
precacheAndRoute(self.__WB_MANIFEST);
cleanupOutdatedCaches();

// Pages come from the server while there is signal (it adds the first screen's data); with none, the precached
// shell, which then reads the saved data. Capability pages (share links, unsubscribe, booking replies) and the API
// never fall back: they mean nothing without the server.
const network = new NetworkOnly();
registerRoute(
  new NavigationRoute(
    async (options) => {
      try {
        return await network.handle(options);
      } catch {
        const shell = await matchPrecache('/index.html');
        if (!shell) return Response.error();
        // Marked so the page knows at once that there is no signal (navigator.onLine may still say there is).
        const html = (await shell.text()).replace('<div id="root">', '<div id="root" data-served-offline>');
        return new Response(html, { headers: shell.headers });
      }
    },
    { denylist: [/^\/api\//, /^\/s\//, /^\/unsubscribe\//, /^\/booking-reply\//] },
  ),
);

// "Update ready: reload": the page asks the waiting worker to take over once the technician taps Reload.
self.addEventListener('message', (event) => {
  if ((event.data as { type?: string } | null)?.type === 'SKIP_WAITING') void self.skipWaiting();
});

// The very first install controls the open page at once, so the first visit already works without signal.
self.addEventListener('activate', (event) => event.waitUntil(self.clients.claim()));

import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import '@fontsource/source-sans-3/400.css';
import '@fontsource/source-sans-3/600.css';
import '@fontsource/source-sans-3/700.css';
import './index.css';
import { App } from './app/app';
import { createAppRouter } from './app/router';
import { keepSavedQueriesInMemory } from './lib/offline/cache-persistence';
import { openLastSession } from './lib/offline/offline-session';
import { readNetworkAtStart } from './lib/network-state';
import { seedPreloadedQueries } from './lib/preload';
import { createQueryClient } from './lib/query-client';

const container = document.getElementById('root')!;
const router = createAppRouter();
const queryClient = createQueryClient();
keepSavedQueriesInMemory(queryClient);
readNetworkAtStart();

const mount = () =>
  createRoot(container).render(
    <StrictMode>
      <App router={router} queryClient={queryClient} />
    </StrictMode>,
  );

const routerReady = new Promise<void>((resolve) => {
  if (router.state.initialized) return resolve();
  const unsubscribe = router.subscribe((state) => {
    if (!state.initialized) return;
    unsubscribe();
    resolve();
  });
});

// React mounts once the router has loaded the page's lazy chunk, so its first render is the page itself. Rendering
// earlier would render the router's hydration fallback (nothing, with a console warning when a route has none) and,
// where the server rendered the first screen into the HTML, blank that screen while the chunk loads. It also waits
// for what this phone saved for the last person signed in (a reload in a basement shows the round, not a spinner);
// the server's embedded first-screen data goes in after it, being newer.
void Promise.all([routerReady, openLastSession(queryClient)]).then(() => {
  seedPreloadedQueries(queryClient);
  mount();
});

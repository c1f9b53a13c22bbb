import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import '@fontsource/source-sans-3/400.css';
import '@fontsource/source-sans-3/600.css';
import '@fontsource/source-sans-3/700.css';
import './index.css';
import { App } from './app/app';
import { createAppRouter } from './app/router';

const container = document.getElementById('root')!;
const router = createAppRouter();
const mount = () =>
  createRoot(container).render(
    <StrictMode>
      <App router={router} />
    </StrictMode>,
  );

// React mounts once the router has loaded the page's lazy chunk, so its first render is the page itself. Rendering
// earlier would render the router's hydration fallback (nothing, with a console warning when a route has none) and,
// where the server rendered the first screen into the HTML, blank that screen while the chunk loads.
if (router.state.initialized) {
  mount();
} else {
  const unsubscribe = router.subscribe((state) => {
    if (!state.initialized) return;
    unsubscribe();
    mount();
  });
}

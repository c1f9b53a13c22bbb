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

// The server rendered this page's first screen: it stays until the page's own chunk has loaded, then React replaces it
// with the same markup in one commit (rendering at once would blank it while the chunk loads).
if (container.hasChildNodes() && !router.state.initialized) {
  const unsubscribe = router.subscribe((state) => {
    if (!state.initialized) return;
    unsubscribe();
    mount();
  });
} else {
  mount();
}

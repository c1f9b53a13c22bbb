/// <reference types="vite-plugin-pwa/vanillajs" />
import { useEffect, useState } from 'react';

/**
 * Installs the service worker (production builds only) and, when a new version has been deployed and is waiting,
 * offers to reload into it. It never reloads by itself: a technician may be halfway through a visit.
 */
export function UpdatePrompt() {
  const [update, setUpdate] = useState<null | (() => Promise<void>)>(null);
  useEffect(() => {
    if (!import.meta.env.PROD || !('serviceWorker' in navigator)) return;
    let cancelled = false;
    // After the first screen: registering and precaching must not compete with it for a weak signal.
    const start = () =>
      void import('virtual:pwa-register').then(({ registerSW }) => {
        if (cancelled) return;
        const updateSW = registerSW({ immediate: true, onNeedRefresh: () => setUpdate(() => () => updateSW(true)) });
      });
    if (document.readyState === 'complete') start();
    else window.addEventListener('load', start, { once: true });
    return () => {
      cancelled = true;
      window.removeEventListener('load', start);
    };
  }, []);
  if (!update) return null;
  return (
    <div role="status" className="no-print fixed inset-x-2 bottom-20 z-40 mx-auto flex max-w-md items-center gap-3 rounded-plate bg-iron px-4 py-3 text-plate shadow-lg sm:bottom-4">
      <p className="flex-1 font-semibold">A new version of Lifeplate is ready.</p>
      <button type="button" className="min-h-tap rounded-plate bg-brass px-4 font-semibold text-iron" onClick={() => void update()}>
        Reload
      </button>
    </div>
  );
}

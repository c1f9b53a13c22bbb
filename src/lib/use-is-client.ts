import { useSyncExternalStore } from 'react';

const noSubscription = () => () => {};

/**
 * False while the server renders a page's first screen, true once React runs in the browser. Controls that only work
 * with JavaScript are disabled in the server's markup, so nothing typed or tapped before the script arrives is lost.
 */
export function useIsClient(): boolean {
  return useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
}

import { onlineManager } from '@tanstack/react-query';
import { useSyncExternalStore } from 'react';

/** The browser's idea of whether there is a network (TanStack Query's online manager, which pauses queries without one). */
export const useOnline = () => useSyncExternalStore(onlineManager.subscribe.bind(onlineManager), () => onlineManager.isOnline());


import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useMe } from '@/lib/auth';
import { confirmSession } from '@/lib/offline/offline-session';
import { outboxHandlers } from './outbox-handlers';

/** Keeps the offline store and the outbox on the person the server says is signed in. */
export function OfflineSession() {
  const queryClient = useQueryClient();
  const userId = useMe().data?.user.id;
  useEffect(() => {
    if (userId && typeof indexedDB !== 'undefined') void confirmSession(queryClient, userId, outboxHandlers(queryClient));
  }, [queryClient, userId]);
  return null;
}

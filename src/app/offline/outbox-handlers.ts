import type { QueryClient } from '@tanstack/react-query';
import { draftStorageKeyPrefix } from '@/lib/offline/draft-keys';
import type { OutboxHandlers } from '@/lib/offline/outbox';
import { applianceKeys } from '@/lib/resources/appliances';
import type { VisitDto } from '@shared/schemas/visits';

const isVisit = (v: unknown): v is VisitDto => Boolean(v && typeof v === 'object' && 'id' in v && 'applianceId' in v && 'revision' in v);

/** What happens when the outbox has sent a write: the server's answer replaces the phone's copy on every screen. */
export function outboxHandlers(queryClient: QueryClient): OutboxHandlers {
  return {
    onSent: (entry, response) => {
      if (entry.kind === 'photos') {
        const applianceId = entry.request.form?.fields.applianceId;
        if (applianceId) void queryClient.invalidateQueries({ queryKey: applianceKeys.record(applianceId) });
        return;
      }
      if (!isVisit(response)) return;
      queryClient.setQueryData(['visit', response.id], response);
      if (entry.kind === 'visit-complete') {
        // The server has the finished visit: the phone's working copy is no longer needed.
        localStorage.removeItem(`${draftStorageKeyPrefix}${response.id}`);
        void queryClient.invalidateQueries({ queryKey: ['bookings'] });
      }
      void queryClient.invalidateQueries({ queryKey: applianceKeys.record(response.applianceId) });
    },
    onConflict: async (entry) => {
      if (entry.kind !== 'visit-complete') return null;
      const { redoCompletion } = await import('@/features/visits/draft/redo-completion');
      return redoCompletion(entry);
    },
  };
}

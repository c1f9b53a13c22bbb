import { useEffect } from 'react';
import { useQueries, useQueryClient } from '@tanstack/react-query';
import { applianceRecordQueryOptions, timelineQueryOptions } from '@/lib/resources/appliances';
import { checklistTemplatesQueryOptions } from '@/lib/resources/checklist-templates';
import { componentTypesQueryOptions } from '@/lib/resources/component-types';
import { useOnline } from './use-online';

/**
 * Saves what a round's appliances need with no signal: each record and its timeline's first page, the catalog and the
 * checklist templates (a visit started offline builds its checklist from them). The records load through the cache
 * like any screen's, so they are saved with it (cache-persistence.ts). Returns how many records are on the phone.
 */
export function useSavedForOffline(applianceIds: readonly string[]) {
  const online = useOnline();
  const queryClient = useQueryClient();
  const records = useQueries({ queries: applianceIds.map((id) => ({ ...applianceRecordQueryOptions(id), enabled: online })) });
  const idsKey = applianceIds.join(',');
  useEffect(() => {
    if (!online || !idsKey) return;
    const ids = idsKey.split(',');
    // Each failure only means that piece is not saved; the record screen says so if it is opened with no signal.
    void Promise.allSettled([
      ...ids.map((id) => queryClient.prefetchInfiniteQuery(timelineQueryOptions(id))),
      queryClient.prefetchQuery(componentTypesQueryOptions()),
      queryClient.prefetchQuery(checklistTemplatesQueryOptions()),
    ]);
  }, [online, idsKey, queryClient]);
  return { saved: records.filter((r) => r.data !== undefined).length, total: applianceIds.length, online };
}

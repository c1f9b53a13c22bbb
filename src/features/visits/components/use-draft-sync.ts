import { useEffect, useState, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { VisitDto } from '@shared/schemas/visits';
import { completeVisit } from '../api/complete-visit';
import { getVisit, visitQueryOptions } from '../api/get-visit';
import { saveVisitDraft } from '../api/save-draft';
import { DraftSync } from '../draft/draft-sync';

const transport = { put: saveVisitDraft, get: getVisit, complete: completeVisit };

/** One DraftSync per visit, fed the first server copy; every server answer it gets goes into the query cache. */
export function useDraftSync(initial: VisitDto) {
  const qc = useQueryClient();
  const [sync] = useState(() => new DraftSync(initial.id, initial, transport, (v) => qc.setQueryData(visitQueryOptions(v.id).queryKey, v)));
  useEffect(() => {
    sync.start();
    return () => sync.stop();
  }, [sync]);
  const snapshot = useSyncExternalStore(sync.subscribe, sync.getSnapshot);
  return { sync, snapshot };
}

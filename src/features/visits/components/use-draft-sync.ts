import { useEffect, useRef, useState, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { VisitDto } from '@shared/schemas/visits';
import { useOutbox } from '@/lib/offline/offline-session';
import { completeVisit } from '../api/complete-visit';
import { getVisit, visitQueryOptions } from '../api/get-visit';
import { saveVisitDraft } from '../api/save-draft';
import { isWaitingBehind, nameVisitForOutbox, queueCompletion } from '../api/visit-outbox';
import { DraftSync, type DraftTransport } from '../draft/draft-sync';

/**
 * One DraftSync per visit, fed the first server copy; every server answer it gets goes into the query cache. With no
 * signal its saves wait (on this phone) behind the visit's writes in the outbox, and a completion joins the outbox.
 * `label` names the visit on the waiting list ("Finish the visit · Boiler, 12 Tinderwick Lane").
 */
export function useDraftSync(initial: VisitDto, label: string) {
  const qc = useQueryClient();
  useEffect(() => nameVisitForOutbox(initial.id, label), [initial.id, label]);
  const [sync] = useState(() => {
    const transport: DraftTransport = {
      put: saveVisitDraft,
      get: getVisit,
      complete: completeVisit,
      waitingBehind: isWaitingBehind,
      queueComplete: queueCompletion,
    };
    return new DraftSync(initial.id, initial, transport, (v) => qc.setQueryData(visitQueryOptions(v.id).queryKey, v));
  });
  useEffect(() => {
    sync.start();
    return () => sync.stop();
  }, [sync]);

  // Once the outbox has sent this visit's earlier writes (its start, a part swap), the draft's own saves follow.
  const held = useOutbox().snapshot.entries.some((e) => e.visitId === initial.id);
  const wasHeld = useRef(held);
  useEffect(() => {
    if (wasHeld.current && !held) {
      const latest = qc.getQueryData(visitQueryOptions(initial.id).queryKey);
      if (latest) sync.adopt(latest);
      sync.retryNow();
    }
    wasHeld.current = held;
  }, [held, qc, initial.id, sync]);

  const snapshot = useSyncExternalStore(sync.subscribe, sync.getSnapshot);
  return { sync, snapshot };
}

import type { ReactNode } from 'react';
import { useEffect, useState } from 'react';
import { useParams } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { Page, Spinner } from '@/components/ui/page';
import { ApiError } from '@/lib/api-client';
import type { VisitDto } from '@shared/schemas/visits';
import { useOutbox } from '@/lib/offline/offline-session';
import { useVisit } from '../api/get-visit';
import { queuedOf } from '../api/visit-outbox';
import { FinishedOnPhone, RefusedFinish } from './finished-on-phone';
import { CompletedVisit } from './completed-visit';
import { VisitEditor } from './visit-editor';

/** The photos section belongs to another feature and is handed in by the app's router. */
export type VisitSlots = {
  photos?: (applianceId: string, visitId: string) => ReactNode;
  /** The completed visit's history of changes (owners and managers). */
  changes?: (applianceId: string, visitId: string) => ReactNode;
};

export function VisitPage({ slots = {} }: { slots?: VisitSlots }) {
  const { id = '' } = useParams();
  const visit = useVisit(id);
  const { outbox, snapshot: box } = useOutbox();
  const [queuedFinish] = queuedOf(box.entries, id, 'visit-complete');
  /** The visit this screen has just signed off, so the completed view can say so and what happens next. */
  const [completedHere, setCompletedHere] = useState<string | null>(null);
  /** The visit whose draft engine is running: it started from one server copy, and later copies only feed it. */
  const [editing, setEditing] = useState<string | null>(null);
  useEffect(() => {
    window.scrollTo(0, 0);
  }, [id, completedHere]);
  if (visit.isPending && visit.fetchStatus === 'paused') {
    return (
      <Page title="Visit">
        <Notice kind="caution" title="No signal">
          This visit has not been opened on this phone before. It opens by itself when signal returns.
        </Notice>
      </Page>
    );
  }
  if (visit.isPending) return <Spinner label="Loading the visit…" />;
  if (visit.isError) {
    return (
      <Page title="Visit">
        <Notice kind="danger" title={visit.error instanceof ApiError && visit.error.status === 404 ? 'Not found' : 'Not loaded'}>
          {visit.error instanceof ApiError && visit.error.offline
            ? 'No signal, and this visit has not been opened on this phone before. Try again when signal returns.'
            : visit.error.message}
        </Notice>
      </Page>
    );
  }
  if (visit.data.status === 'completed') return <CompletedVisit visit={visit.data} justCompleted={completedHere === visit.data.id} changes={slots.changes?.(visit.data.applianceId, visit.data.id)} />;
  // A copy saved on this phone is being checked with the server: the draft engine starts from the server's answer.
  if (editing !== id && visit.fetchStatus === 'fetching') return <Spinner label="Loading the visit…" />;
  if (queuedFinish?.state === 'waiting' && outbox) return <FinishedOnPhone visit={visit.data} entry={queuedFinish} onSendNow={outbox.retryNow} />;
  return (
    <>
      {queuedFinish && outbox && (
        <div className="mx-auto max-w-3xl px-3 pt-3 sm:px-6">
          <RefusedFinish entry={queuedFinish} onCorrect={() => void outbox.discard(queuedFinish.seq)} />
        </div>
      )}
      <DraftVisit key={id} visit={visit.data} photos={slots.photos?.(visit.data.applianceId, visit.data.id)} onCompleting={setCompletedHere} onShown={setEditing} />
    </>
  );
}

/** Holds on to the first server copy: the draft engine starts from it once, later copies only feed the display. */
function DraftVisit({
  visit,
  photos,
  onCompleting,
  onShown,
}: {
  visit: VisitDto;
  photos?: ReactNode;
  onCompleting: (visitId: string | null) => void;
  onShown: (visitId: string) => void;
}) {
  const [initial] = useState(visit);
  useEffect(() => onShown(initial.id), [initial.id, onShown]);
  return <VisitEditor initial={initial} visit={visit} photos={photos} onCompleting={onCompleting} />;
}

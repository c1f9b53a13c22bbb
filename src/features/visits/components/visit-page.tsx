import { useEffect, useState } from 'react';
import { useParams } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { Page, Spinner } from '@/components/ui/page';
import { ApiError } from '@/lib/api-client';
import type { VisitDto } from '@shared/schemas/visits';
import { useVisit } from '../api/get-visit';
import { CompletedVisit } from './completed-visit';
import { VisitEditor } from './visit-editor';

export function VisitPage() {
  const { id = '' } = useParams();
  const visit = useVisit(id);
  useEffect(() => {
    window.scrollTo(0, 0);
  }, [id]);
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
  if (visit.data.status === 'completed') return <CompletedVisit visit={visit.data} />;
  return <DraftVisit key={id} visit={visit.data} />;
}

/** Holds on to the first server copy: the draft engine starts from it once, later copies only feed the display. */
function DraftVisit({ visit }: { visit: VisitDto }) {
  const [initial] = useState(visit);
  return <VisitEditor initial={initial} visit={visit} />;
}

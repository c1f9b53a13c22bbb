import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import type { VisitDto } from '@shared/schemas/visits';
import { useAmendVisit } from '../api/amend-visit';
import { Panel, TextArea } from './inputs';
import { FORM_ERROR_KEY } from '@shared/schemas/errors';

/** A correction is added beside the original, never over it; it needs a reason. */
export function AmendForm({ visit, current }: { visit: VisitDto; current: { findings: string; recommendations: string } }) {
  const amend = useAmendVisit();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [findings, setFindings] = useState(current.findings);
  const [recommendations, setRecommendations] = useState(current.recommendations);
  const details = amend.error instanceof ApiError ? amend.error.details : undefined;

  if (!open) {
    return (
      <Button variant="secondary" onClick={() => setOpen(true)}>
        ✎ Amend this visit
      </Button>
    );
  }
  return (
    <Panel title="Amend this visit">
      {amend.isError && (
        <Notice kind="danger" title="Not amended">
          {amend.error.message}
        </Notice>
      )}
      <TextArea label="Why it is being corrected" value={reason} onChange={setReason} maxLength={2000} rows={2} error={details?.reason} />
      <TextArea label="Findings" value={findings} onChange={setFindings} error={details?.findings} />
      <TextArea label="Recommendations" value={recommendations} onChange={setRecommendations} error={details?.recommendations} />
      {details?.[FORM_ERROR_KEY] && <p role="alert" className="text-sm font-semibold text-due">⚠ {details[FORM_ERROR_KEY].join(' ')}</p>}
      <div className="flex gap-2">
        <Button
          className="flex-1"
          disabled={amend.isPending}
          onClick={() =>
            amend.mutate(
              {
                visitId: visit.id,
                reason,
                findings: findings !== current.findings ? findings : undefined,
                recommendations: recommendations !== current.recommendations ? recommendations : undefined,
              },
              { onSuccess: () => { setOpen(false); setReason(''); } },
            )
          }
        >
          {amend.isPending ? 'Saving…' : 'Save amendment'}
        </Button>
        <Button variant="ghost" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </Panel>
  );
}

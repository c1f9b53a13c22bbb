import { useMemo, useState, type ReactNode } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Page } from '@/components/ui/page';
import { ApiError } from '@/lib/api-client';
import { LABELS } from '@shared/schemas/enums';
import type { VisitDto } from '@shared/schemas/visits';
import { applianceQueryOptions, useAppliance } from '../api/get-appliance';
import { readingErrors } from '../draft/draft-fields';
import { computeLiveResults } from '../lib/live-results';
import { useMe } from '@/lib/auth';
import { useUnitPrefs } from '../lib/unit-prefs';
import { Checklist } from './checklist';
import { DraftContext, type DraftEditor } from './draft-context';
import { Panel } from './inputs';
import { NotesSection, OutcomeSection } from './outcome-section';
import { SaveStatus } from './save-status';
import { ServerResults } from './server-results';
import { SwapParts } from './swap-parts';
import { UnitToggle } from './unit-toggle';
import { useDraftSync } from './use-draft-sync';

export function VisitEditor({ initial, visit, photos }: { initial: VisitDto; visit: VisitDto; photos?: ReactNode }) {
  const { sync, snapshot } = useDraftSync(initial);
  const appliance = useAppliance(visit.applianceId);
  const [prefs] = useUnitPrefs();
  const tolerancePct = useMe().data?.company?.underFiringTolerancePct ?? null;
  const navigate = useNavigate();
  const qc = useQueryClient();
  const [completing, setCompleting] = useState(false);
  const [completeError, setCompleteError] = useState<ApiError | Error | null>(null);
  const { fields } = snapshot;
  const a = appliance.data?.appliance;

  const live = useMemo(() => computeLiveResults(fields.readings, a, tolerancePct), [fields.readings, a, tolerancePct]);
  const errors = useMemo(
    () => ({ ...snapshot.errors, ...(completeError instanceof ApiError ? completeError.details : {}), ...readingErrors(fields.readings) }),
    [snapshot.errors, completeError, fields.readings],
  );
  const ctx: DraftEditor = { visitId: visit.id, fields, edit: (c) => sync.edit(c), errors, appliance: a, prefs, live };
  const outcomeNeeded = visit.outcomeRequired || live.stopFlags.length > 0 || live.lwcoFailed;
  const blocked = outcomeNeeded && !fields.outcome;

  async function complete() {
    setCompleting(true);
    setCompleteError(null);
    try {
      const done = await sync.complete();
      await qc.invalidateQueries({ queryKey: applianceQueryOptions(done.applianceId).queryKey });
      navigate(`/appliances/${done.applianceId}`);
    } catch (e) {
      setCompleteError(e instanceof Error ? e : new Error('Not completed.'));
      setCompleting(false);
    }
  }

  return (
    <DraftContext.Provider value={ctx}>
      <Page
        title={LABELS.visitType[visit.type]}
        subtitle={
          <Link to={`/appliances/${visit.applianceId}`} className="underline">
            {appliance.data ? `${appliance.data.customer.name} · ${appliance.data.site.street}` : 'Back to the life record'}
          </Link>
        }
      >
        <Notice kind="caution" title="Work safely">
          Gas, carbon monoxide, steam and hot surfaces can hurt you. Follow the manufacturer&apos;s instructions, local codes and licensed practice.
        </Notice>
        {live.stopFlags.length > 0 && (
          <Notice kind="danger" title="Stop">
            {live.stopFlags.map((f) => f.message).join(' ')} Make the appliance safe before anything else.
          </Notice>
        )}
        <UnitToggle />
        <Checklist items={visit.checklist} />
        <ServerResults results={visit.results} />
        <SwapParts visit={visit} components={appliance.data?.components} onSwapped={(v) => sync.adopt(v)} />
        {photos}
        <NotesSection serverErrors={errors} />
        <OutcomeSection required={outcomeNeeded} serverErrors={errors} />
        <Panel title="Finish">
          {completeError && (
            <Notice kind="danger" title="Not completed">
              {completeError instanceof ApiError && completeError.offline
                ? 'No signal: completing needs the server. Everything is saved on this phone; try again when signal returns.'
                : completeError.message}
            </Notice>
          )}
          {blocked && (
            <p className="font-semibold text-due" id="complete-blocked">
              ⚠ Choose an outcome first: a stop reading or a failed low-water cutoff is recorded.
            </p>
          )}
          <Button className="min-h-14 text-xl" disabled={blocked || completing} aria-describedby={blocked ? 'complete-blocked' : undefined} onClick={complete}>
            {completing ? 'Completing…' : 'Complete visit'}
          </Button>
        </Panel>
        <SaveStatus status={snapshot.status} message={snapshot.message} onRetry={sync.retryNow} />
      </Page>
    </DraftContext.Provider>
  );
}

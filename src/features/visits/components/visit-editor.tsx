import { useCallback, useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { Notice } from '@/components/ui/notice';
import { Page } from '@/components/ui/page';
import { ApiError } from '@/lib/api-client';
import { LABELS } from '@shared/schemas/enums';
import { FORM_ERROR_KEY } from '@shared/schemas/errors';
import type { VisitDto } from '@shared/schemas/visits';
import { alertsOf, requirementDetails, type Requirement } from '@shared/visits/completion-requirements';
import { computeReadingResults } from '@shared/visits/visit-results';
import { applianceKeys, useApplianceRecord } from '@/lib/resources/appliances';
import { readingErrors } from '../draft/draft-fields';
import { jumpToField } from '../lib/jump-to-field';
import { liveRequirements } from '../lib/live-requirements';
import { resultFacts } from '../lib/result-facts';
import { useMe } from '@/lib/auth';
import { useUnitPrefs } from '../lib/unit-prefs';
import { Checklist } from './checklist';
import { DraftContext, type DraftEditor } from './draft-context';
import { FinishPanel } from './finish-panel';
import { NotesSection, OutcomeSection } from './outcome-section';
import { SaveStatus } from './save-status';
import { ServerResults } from './server-results';
import { SwapParts } from './swap-parts';
import { UnitToggle } from './unit-toggle';
import { useDraftSync } from './use-draft-sync';

/** Server field errors the live rule did not name (it cannot know everything the server checks), for the list. */
function serverOnly(error: unknown, live: Requirement[]): Requirement[] {
  if (!(error instanceof ApiError) || error.status !== 400 || !error.details) return [];
  const known = new Set(live.map((r) => r.field));
  return Object.entries(error.details)
    .filter(([field]) => !known.has(field))
    .flatMap(([field, messages]) => messages.map((message) => ({ field, label: field === FORM_ERROR_KEY ? 'Visit' : field, message })));
}

/** `onCompleting` names the visit being signed off from this screen (null if that failed), so the completed view can confirm it. */
export function VisitEditor({
  initial,
  visit,
  photos,
  onCompleting,
}: {
  initial: VisitDto;
  visit: VisitDto;
  photos?: ReactNode;
  onCompleting: (visitId: string | null) => void;
}) {
  const appliance = useApplianceRecord(visit.applianceId);
  const where = appliance.data ? `${appliance.data.customer.name}, ${appliance.data.site.street}` : LABELS.visitType[visit.type];
  const { sync, snapshot } = useDraftSync(initial, `Finish the visit · ${where}`);
  const [prefs] = useUnitPrefs();
  const tolerancePct = useMe().data?.company?.underFiringTolerancePct ?? null;
  const qc = useQueryClient();
  const [completing, setCompleting] = useState(false);
  const [completeError, setCompleteError] = useState<ApiError | Error | null>(null);
  const [tried, setTried] = useState(false);
  const [badText, setBadText] = useState<Record<string, string>>({});
  const { fields } = snapshot;
  const a = appliance.data?.appliance;

  const reportBadText = useCallback(
    (path: string, text: string | null) =>
      setBadText((prev) => {
        if ((prev[path] ?? null) === text) return prev;
        const next = { ...prev };
        if (text === null) delete next[path];
        else next[path] = text;
        return next;
      }),
    [],
  );

  const site = appliance.data?.site;
  const facts = useMemo(() => resultFacts(a, tolerancePct, site), [a, tolerancePct, site]);
  // The same function the server runs on every save, so the phone shows the flags the server will store.
  const live = useMemo(() => computeReadingResults(fields.readings, facts), [fields.readings, facts]);
  const liveList = useMemo(() => liveRequirements({ visit, fields, live, appliance: a, badText }), [visit, fields, live, a, badText]);
  const requirements = useMemo(() => [...liveList, ...serverOnly(completeError, liveList)], [liveList, completeError]);
  const errors = useMemo(
    () => ({ ...snapshot.errors, ...(tried ? requirementDetails(requirements) : {}), ...readingErrors(fields.readings) }),
    [snapshot.errors, tried, requirements, fields.readings],
  );
  const alerts = alertsOf({ flags: live.flags, lowWaterCutoffFailed: live.lowWaterCutoffFailed });
  const ctx: DraftEditor = {
    visitId: visit.id,
    fields,
    edit: (c) => sync.edit(c),
    errors,
    appliance: a,
    elevationFt: site?.elevationFt ?? null,
    prefs,
    live,
    requiredReadings: visit.requiredReadings ?? [],
    reportBadText,
    completionTried: tried,
  };

  async function complete() {
    setCompleteError(null);
    if (liveList.length) {
      setTried(true);
      jumpToField(liveList[0].field);
      return;
    }
    setCompleting(true);
    onCompleting(visit.id);
    try {
      const done = await sync.complete();
      // The record behind the visit changed (parts, due dates, history); this screen now shows the completed visit.
      // With no signal (done is null) the visit is finished on this phone and waits in the outbox instead.
      if (done) void qc.invalidateQueries({ queryKey: applianceKeys.record(done.applianceId) });
    } catch (e) {
      onCompleting(null);
      const err = e instanceof Error ? e : new Error('Not completed.');
      setCompleteError(err);
      setCompleting(false);
      if (err instanceof ApiError && err.status === 400 && err.details) {
        setTried(true);
        const first = Object.keys(err.details)[0];
        if (first) requestAnimationFrame(() => jumpToField(first));
      }
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
        <OutcomeSection alerts={alerts} serverErrors={errors} />
        <FinishPanel requirements={requirements} tried={tried} completing={completing} completeError={completeError} onComplete={complete} onJump={jumpToField} />
        <SaveStatus status={snapshot.status} message={snapshot.message} onRetry={sync.retryNow} />
      </Page>
    </DraftContext.Provider>
  );
}

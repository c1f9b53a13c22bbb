import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { Page } from '@/components/ui/page';
import { StatusBadge } from '@/components/ui/status-badge';
import { useMe } from '@/lib/auth';
import { formatCalendarDate, formatInstant } from '@shared/format/dates';
import { can } from '@shared/policy';
import { LABELS } from '@shared/schemas/enums';
import type { ReadingKey, VisitDto } from '@shared/schemas/visits';
import { addYears } from '@shared/trade/iso-date';
import { provenanceWords } from '@shared/transfers/provenance-words';
import { READING_LABELS } from '@shared/visits/reading-labels';
import { AmendForm } from './amend-form';
import { Panel } from './inputs';
import { ServerResults } from './server-results';
import { OUTCOME_LABELS } from '@shared/glossary';

const dayFormat = { format: (isoDate: string) => formatCalendarDate(isoDate) };
const stampFormat = { format: (iso: string) => formatInstant(iso, Intl.DateTimeFormat().resolvedOptions().timeZone) };

const MARK_LOOK = { done: 'ok', not_applicable: 'info', needs_attention: 'due' } as const;

/** The latest corrected value of a top-level field, or the original when no amendment changed it. */
function latest(visit: VisitDto, field: 'findings' | 'recommendations'): string {
  return visit.amendments.reduce<string>((v, a) => (typeof a.changes[field] === 'string' ? (a.changes[field] as string) : v), visit[field]);
}

/** Required readings that were not taken, with the reason given at the time. */
function skippedReadings(visit: VisitDto): { label: string; reason: string }[] {
  return Object.entries(visit.readingSkips ?? {})
    .filter(([key, reason]) => reason && visit.readings[key as ReadingKey] == null)
    .map(([key, reason]) => ({ label: READING_LABELS[key as ReadingKey] ?? key, reason: reason! }));
}

export function CompletedVisit({ visit, justCompleted = false, changes }: { visit: VisitDto; justCompleted?: boolean; changes?: ReactNode }) {
  const me = useMe();
  const principal = me.data?.principal;
  const mayAmend =
    can(principal, 'visits:amend-any') || (can(principal, 'visits:amend-own') && visit.technicians.some((t) => t.id === principal?.userId));
  const sections = [...new Set(visit.checklist.map((i) => i.section))];
  const skipped = skippedReadings(visit);

  return (
    <Page
      title={`${LABELS.visitType[visit.type]} · ${dayFormat.format(visit.visitedOn)}`}
      subtitle={
        <Link to={`/appliances/${visit.applianceId}`} className="underline">
          Back to the life record
        </Link>
      }
    >
      {justCompleted && <JustCompleted visit={visit} mayAmend={mayAmend} />}
      {visit.recordedElsewhere && (
        <Notice title="Recorded by another company">
          {provenanceWords(visit.recordedElsewhere, me.data?.company?.timeZone ?? 'UTC')}. It stays as they signed it off; corrections are amendments.
        </Notice>
      )}
      <p className="flex flex-wrap items-center gap-2">
        <StatusBadge status="ok">Completed</StatusBadge>
        {visit.technicians.map((t) => t.name).join(', ')}
        <a className="min-h-tap inline-flex items-center font-semibold underline" href={`/api/visits/${visit.id}/report`} download>
          Visit report (PDF)
        </a>
      </p>
      {visit.outcome === 'shut_down_unsafe' ? (
        <Notice kind="danger" title={OUTCOME_LABELS.shut_down_unsafe}>
          {visit.outcomeReason} {visit.outcomeToldWhom && `Told: ${visit.outcomeToldWhom}.`}
        </Notice>
      ) : visit.outcome === 'left_operating' ? (
        <StatusBadge status="ok">{OUTCOME_LABELS.left_operating}</StatusBadge>
      ) : null}

      <Panel title="As recorded on the day">
        <Field label="Findings" value={visit.findings} />
        <Field label="Recommendations" value={visit.recommendations} />
        {visit.customerAckName && <Field label="Acknowledged by the customer" value={visit.customerAckName} />}
        {visit.swaps.length > 0 && (
          <Field label="Parts swapped" value={visit.swaps.map((s) => `${s.typeLabel} (${dayFormat.format(s.swappedOn)})${s.reason ? `: ${s.reason}` : ''}`).join('; ')} />
        )}
        <ServerResults results={visit.results} title="Results" />
        {skipped.length > 0 && (
          <Field label="Required readings not taken" value={skipped.map((s) => `${s.label}: ${s.reason}`).join('\n')} />
        )}
        {sections.map((section) => (
          <div key={section}>
            <h3 className="font-bold">{section}</h3>
            <ul className="text-sm">
              {visit.checklist
                .filter((i) => i.section === section)
                .map((i) => (
                  <li key={i.key} className="flex flex-wrap items-center justify-between gap-2 border-b border-plate-line py-1">
                    <span>
                      {i.label}
                      {i.note && <span className="block text-iron-muted">{i.note}</span>}
                    </span>
                    {i.mark ? <StatusBadge status={MARK_LOOK[i.mark]}>{LABELS.checkMark[i.mark]}</StatusBadge> : <span className="text-iron-muted">Not marked</span>}
                  </li>
                ))}
            </ul>
          </div>
        ))}
      </Panel>

      {visit.amendments.length > 0 && (
        <Panel title="Amendments">
          <ol className="flex flex-col gap-3">
            {visit.amendments.map((a) => (
              <li key={a.id} className="rounded-plate border-l-4 border-brass bg-plate p-2" data-amendment={a.id}>
                <p className="font-semibold">{a.reason}</p>
                <p className="text-sm text-iron-muted">
                  {stampFormat.format(a.createdAt)} {a.createdByName ? `· ${a.createdByName}` : ''}
                </p>
                <ChangeList changes={a.changes} />
              </li>
            ))}
          </ol>
        </Panel>
      )}
      {mayAmend && <AmendForm visit={visit} current={{ findings: latest(visit, 'findings'), recommendations: latest(visit, 'recommendations') }} />}
      {changes}
    </Page>
  );
}

/** The confirmation right after signing off, with what the sign-off set in motion. */
function JustCompleted({ visit, mayAmend }: { visit: VisitDto; mayAmend: boolean }) {
  const nextAnnual = visit.type === 'annual_maintenance' ? dayFormat.format(addYears(visit.visitedOn, 1)) : null;
  return (
    <Notice kind="done" title="Visit completed">
      <ul className="mt-1 list-disc pl-5">
        <li>
          Signed off{visit.signedOffBy ? ` by ${visit.signedOffBy.name}` : ''}
          {visit.signedOffAt ? ` on ${stampFormat.format(visit.signedOffAt)}` : ''}. It is on the appliance&apos;s life record now, and the homeowner
          sees it through their share link or sign-in.
        </li>
        {visit.outcome === 'shut_down_unsafe' ? (
          <li>The record shows the appliance shut down as unsafe until a later visit leaves it operating.</li>
        ) : null}
        {nextAnnual && <li>The next annual service is due {nextAnnual}; the due list counts from this visit.</li>}
        {visit.swaps.length > 0 && <li>Parts swapped today are on the record with their new due dates.</li>}
        {mayAmend && <li>Something wrong? Correct it below: the original stays on record beside the correction.</li>}
      </ul>
      <p className="mt-2">
        <Link to={`/appliances/${visit.applianceId}`} className="font-semibold underline">
          Back to the life record
        </Link>
      </p>
    </Notice>
  );
}

function Field({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <p className="text-sm font-semibold">{label}</p>
      <p className="whitespace-pre-wrap">{value || '—'}</p>
    </div>
  );
}

const CHANGE_LABEL: Record<string, string> = {
  findings: 'Findings',
  recommendations: 'Recommendations',
  checklist: 'Checklist',
  readings: 'Readings',
  outcome: 'Outcome',
  swaps: 'Part-swap dates',
};

function ChangeList({ changes }: { changes: Record<string, unknown> }) {
  return (
    <dl className="mt-1 text-sm">
      {Object.entries(changes)
        .filter(([k]) => k !== 'results')
        .map(([k, v]) => (
          <div key={k}>
            <dt className="font-semibold">{CHANGE_LABEL[k] ?? k}, corrected to:</dt>
            <dd className="whitespace-pre-wrap">{typeof v === 'string' ? v || '—' : describe(k, v)}</dd>
          </div>
        ))}
    </dl>
  );
}

function describe(key: string, v: unknown): string {
  if (key === 'swaps' && Array.isArray(v)) return v.map((s: { swappedOn?: string; previousSwappedOn?: string }) => `${s.previousSwappedOn ? dayFormat.format(s.previousSwappedOn) : '?'} → ${s.swappedOn ? dayFormat.format(s.swappedOn) : '?'}`).join('; ');
  if (key === 'outcome' && v && typeof v === 'object') {
    const o = v as { outcome?: keyof typeof LABELS.visitOutcome; outcomeReason?: string };
    return [o.outcome ? LABELS.visitOutcome[o.outcome] : null, o.outcomeReason].filter(Boolean).join(': ');
  }
  if (key === 'checklist' && Array.isArray(v)) return `${v.length} item(s) re-marked`;
  return 'changed';
}

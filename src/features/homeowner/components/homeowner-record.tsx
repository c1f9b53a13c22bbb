import type { ReactNode } from 'react';
import { formatCalendarDate, formatVisitWindow } from '@shared/format/dates';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { StatusBadge } from '@/components/ui/status-badge';
import type { HomeownerViewDto } from '@shared/schemas/homeowner';
import { lifeRecordPath, visitReportPath, type RecordSource } from '../api/record-source';
import { HomeownerPhotos } from './homeowner-photos';
import { SafetyNotes } from './safety-notes';
import { ServiceRequestForm } from './service-request-form';
import { explainSteps, OUTCOME_LABELS, RECORD_SECTIONS } from '@shared/glossary';

const date = (iso: string) => formatCalendarDate(iso, { long: true });

/** The homeowner's life record: read-only, plain words first, the numbers alongside. */
export function HomeownerRecord({ view, source, after }: { view: HomeownerViewDto; source: RecordSource; after?: ReactNode }) {
  const a = view.appliance;
  return (
    <div className="mx-auto flex w-full max-w-2xl flex-col gap-4 px-3 py-4">
      <header>
        <h1 className="text-2xl font-bold">Your {a.title.toLowerCase()}</h1>
        <p className="text-iron-muted">
          {a.address}
          {a.location ? ` · ${a.location}` : ''}
        </p>
      </header>
      {view.unsafe && (
        <Notice kind="danger" title={`Shut down as unsafe on ${date(view.unsafe.visitedOn)}`}>
          <p>{view.unsafe.reason ?? 'The technician found a fault that makes it unsafe to run.'}</p>
          <p className="mt-1 font-semibold">Do not turn it back on or relight it yourself. Call {view.company.name} to have the fault repaired first.</p>
        </Notice>
      )}
      <Card title={RECORD_SECTIONS.whatItIs}>
        <p>
          {a.title}
          {a.makeAndModel ? `, made by ${a.makeAndModel}` : ''}.
          {a.ageYears !== null ? ` It is ${a.ageYears} years old${a.installedOn ? ` (installed ${date(a.installedOn)})` : ''}.` : ''}
        </p>
        {view.lifeExpectancy && <p className="mt-1 text-sm text-iron-muted">{view.lifeExpectancy}</p>}
      </Card>
      <Card title="What is coming up">
        {view.nextBooking && (
          <p className="mb-2" data-testid="next-booking">
            Your next visit is booked for <strong>{formatVisitWindow(view.nextBooking.startsAt, view.nextBooking.endsAt, view.nextBooking.timeZone)}</strong>
            {view.nextBooking.status === 'confirmed' ? ' (confirmed)' : ''}. {view.nextBooking.technicianFirstName} will come.
          </p>
        )}
        {view.nextAnnualServiceDue && (
          <p className="mb-2">
            Next yearly service due by <strong>{date(view.nextAnnualServiceDue)}</strong>.
          </p>
        )}
        {view.comingDue.length ? (
          <ul className="flex flex-col gap-2">
            {view.comingDue.map((d) => (
              <li key={`${d.part}-${d.dueOn}`} className="border-b border-plate-line pb-2">
                <StatusBadge status={d.what === 'replace' ? 'due' : 'soon'}>{d.what === 'replace' ? 'Replace' : 'Check'}</StatusBadge>{' '}
                <span className="font-semibold">{d.part}</span> · {date(d.dueOn)}
                <p className="text-sm">{d.meaning}</p>
              </li>
            ))}
          </ul>
        ) : (
          <p>Nothing else is coming due.</p>
        )}
        <p className="mt-2 text-sm">
          To book a visit, call {view.company.name} at{' '}
          <a className="font-semibold underline" href={`tel:${view.company.phone}`}>
            {view.company.phone}
          </a>
          .
        </p>
      </Card>
      <ServiceRequestForm source={source} company={view.company} />
      <Card title="Visits">
        {!view.visits.length && <p>No visits are recorded yet.</p>}
        <ol className="flex flex-col gap-4">
          {view.visits.map((v) => (
            <li key={v.id} className="border-b border-plate-line pb-3">
              <p className="font-semibold">
                {date(v.visitedOn)} · {v.what}
              </p>
              {v.outcome === 'shut_down_unsafe' ? (
                <StatusBadge status="unsafe">{v.outcomeWords ?? OUTCOME_LABELS.shut_down_unsafe}</StatusBadge>
              ) : (
                v.outcomeWords && <StatusBadge status="ok">{v.outcomeWords}</StatusBadge>
              )}
              {v.checked.length > 0 && <CheckedSteps sections={v.checked} />}
              {v.replaced.map((r) => (
                <p key={r.part} className="text-sm">
                  Replaced the {r.part}
                  {r.reason ? `: ${r.reason}` : ''}.
                </p>
              ))}
              {v.readingsInWords.map((w) => (
                <p key={w} className="text-sm">
                  {w}
                </p>
              ))}
              {v.findings && <p className="mt-1 text-sm">{v.findings}</p>}
              {v.recommendations && <p className="text-sm">Recommended: {v.recommendations}</p>}
              <a className="min-h-tap inline-flex items-center text-sm font-semibold underline" href={visitReportPath(source, v.id)} download>
                Download the visit report (PDF)
              </a>
              {Object.keys(v.readings).length > 0 && (
                <details className="mt-1 text-xs text-iron-muted">
                  <summary className="cursor-pointer">The numbers</summary>
                  <ul className="tabular">
                    {v.readings.efficiencyPct !== undefined && <li>Combustion efficiency: {v.readings.efficiencyPct} % (higher heating value basis)</li>}
                    {v.readings.coAirFreePpm !== undefined && <li>Carbon monoxide, air-free: {v.readings.coAirFreePpm} ppm</li>}
                  </ul>
                </details>
              )}
            </li>
          ))}
        </ol>
      </Card>
      <HomeownerPhotos source={source} photos={view.photos} />
      <Card title="Keep a copy">
        <p className="text-sm">The whole record, to keep or to hand to the next owner of the house.</p>
        <p className="mt-1 flex flex-wrap gap-4">
          <a className="min-h-tap inline-flex items-center font-semibold underline" href={lifeRecordPath(source, 'pdf')} download>
            Download the whole record (PDF)
          </a>
          <a className="min-h-tap inline-flex items-center font-semibold underline" href={lifeRecordPath(source, 'json')} download>
            As data (JSON)
          </a>
        </p>
      </Card>
      {after}
      <SafetyNotes kind={a.kind} fuel={a.fuel} />
      <p className="text-center text-sm text-iron-muted">
        Kept by {view.company.name} · {view.company.phone}
      </p>
    </div>
  );
}

/** What was checked on a visit, each step with its plain "what we checked and why" line from the glossary. */
function CheckedSteps({ sections }: { sections: string[] }) {
  return (
    <div className="mt-1 text-sm">
      <p className="font-semibold">What we checked</p>
      <ul className="ml-4 list-disc">
        {explainSteps(sections).map(({ step, why }) => (
          <li key={step} data-step={step}>
            <span className="font-semibold">{step}</span>
            {why ? `: ${why}` : ''}
          </li>
        ))}
      </ul>
    </div>
  );
}

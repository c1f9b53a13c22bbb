import { Link, useParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Page, Spinner } from '@/components/ui/page';
import { useMe } from '@/lib/auth';
import { useApplianceRecord } from '@/lib/resources/appliances';
import { LABELS } from '@shared/schemas/enums';
import { formatInstant } from '@shared/format/dates';
import { useBoilerHistory } from '../api/get-boiler-history';
import { useLatestSurvey } from '../api/get-latest-survey';
import { SurveyResult } from './survey-result';
import './proposal-print.css';

/** A page to print (or save as PDF from the print dialog) for the customer: what a replacement must do, and the old boiler's history. */
export function ProposalPage() {
  const { id = '' } = useParams();
  const record = useApplianceRecord(id);
  const latest = useLatestSurvey(id);
  const history = useBoilerHistory(id);
  const me = useMe();
  const timeZone = me.data?.company?.timeZone ?? 'UTC';

  if (record.isPending || latest.isPending) return <Spinner label="Loading the proposal…" />;
  if (record.isError || latest.isError) {
    return (
      <Page title="Replacement proposal">
        <Notice kind="danger" title="Not loaded">
          {(record.error ?? latest.error)?.message}
        </Notice>
      </Page>
    );
  }
  const r = record.data;
  const a = r.appliance;
  const survey = latest.data.survey;
  return (
    <Page title="Replacement proposal" subtitle={`${r.customer.name} · ${r.site.street}, ${r.site.town}`}>
      <div className="proposal flex flex-col gap-4">
        <div className="no-print flex flex-wrap gap-2">
          <Link to={`/appliances/${a.id}/radiation-survey`} className="inline-flex min-h-tap items-center font-semibold underline">
            Back to the survey
          </Link>
          <Button onClick={() => window.print()}>Print</Button>
        </div>
        <section aria-label="The boiler today">
          <h2 className="text-lg font-bold">The boiler today</h2>
          <p>
            {LABELS.applianceKind[a.kind]}, {LABELS.fuel[a.fuel]}
            {r.ageYears !== null && `, about ${r.ageYears} years old`}
            {r.endOfLife?.medianYears != null && ` (planning life ${r.endOfLife.medianYears} years: ${r.endOfLife.source})`}.
          </p>
        </section>
        <section aria-label="What a replacement must do">
          <h2 className="text-lg font-bold">What a replacement must do</h2>
          {survey ? <SurveyResult survey={survey} /> : <Notice title="No survey yet">Take a radiation survey first; the proposal is sized from it.</Notice>}
        </section>
        <section aria-label="History of the old boiler">
          <h2 className="text-lg font-bold">History of the old boiler</h2>
          {history.isPending && <p>Loading the history…</p>}
          {history.data && history.data.length === 0 && <p>No visits or part swaps on record.</p>}
          {history.data && history.data.length > 0 && (
            <ul className="text-sm" data-testid="proposal-history">
              {history.data.map((e) => (
                <li key={e.id} className="border-t border-plate-line py-1">
                  <span className="tabular">{formatInstant(e.occurredAt, timeZone)}</span>: {e.summary}
                </li>
              ))}
            </ul>
          )}
        </section>
      </div>
    </Page>
  );
}

import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Page, Spinner } from '@/components/ui/page';
import { ApiError } from '@/lib/api-client';
import { useMe } from '@/lib/auth';
import { useApplianceRecord } from '@/lib/resources/appliances';
import { can } from '@shared/policy';
import { todayInTimeZone } from '@shared/dates';
import { formatCalendarDate } from '@shared/format/dates';
import { useLatestSurvey } from '../api/get-latest-survey';
import { useSurveys } from '../api/list-surveys';
import { formatEdr } from './format';
import { SurveyForm } from './survey-form';
import { SurveyResult } from './survey-result';

export function RadiationSurveyPage() {
  const { id = '' } = useParams();
  const record = useApplianceRecord(id);
  const latest = useLatestSurvey(id);
  const list = useSurveys(id);
  const me = useMe();
  const [taking, setTaking] = useState(false);

  if (record.isPending || latest.isPending) return <Spinner label="Loading the radiation survey…" />;
  if (record.isError || latest.isError) {
    const err = record.error ?? latest.error;
    return (
      <Page title="Radiation survey">
        <Notice kind="danger" title={err instanceof ApiError && err.status === 404 ? 'Not found' : 'Not loaded'}>
          {err instanceof ApiError && err.status === 404 ? 'There is no appliance at this address in your company’s records.' : err?.message}
        </Notice>
      </Page>
    );
  }
  const a = record.data.appliance;
  const survey = latest.data.survey;
  const canWrite = can(me.data?.principal, 'records:write') && a.status !== 'removed';
  const boiler = a.kind === 'steam_boiler' || a.kind === 'hot_water_boiler';
  const showForm = canWrite && boiler && (taking || !survey);

  return (
    <Page title="Radiation survey" subtitle={`${record.data.customer.name} · ${record.data.site.street}, ${record.data.site.town}`}>
      <Link to={`/appliances/${a.id}`} className="no-print inline-flex min-h-tap items-center font-semibold underline">
        Back to the life record
      </Link>
      {!boiler && <Notice title="Boilers only">A radiation survey sizes a steam or hot-water boiler to its radiators.</Notice>}
      {showForm ? (
        <>
          <p className="text-sm">Room by room, every radiator connected to this boiler: its type and size from the radiator itself, sections counted.</p>
          <SurveyForm
            applianceId={a.id}
            today={todayInTimeZone(me.data?.company?.timeZone ?? 'UTC')}
            system={a.kind === 'hot_water_boiler' ? 'hot_water' : 'steam'}
            onSaved={() => setTaking(false)}
            onCancel={survey ? () => setTaking(false) : undefined}
          />
        </>
      ) : survey ? (
        <>
          <SurveyResult survey={survey} />
          <div className="no-print flex flex-wrap gap-2">
            <Link to={`/appliances/${a.id}/radiation-survey/proposal`} className="inline-flex min-h-tap items-center rounded-plate bg-iron px-4 font-semibold text-plate">
              Replacement proposal
            </Link>
            {canWrite && (
              <Button variant="secondary" onClick={() => setTaking(true)}>
                Take a new survey
              </Button>
            )}
          </div>
          {list.data && list.data.length > 1 && (
            <section aria-label="Earlier surveys">
              <h2 className="text-lg font-bold">Earlier surveys</h2>
              <ul className="tabular text-sm">
                {list.data.slice(1).map((s) => (
                  <li key={s.id}>
                    {formatCalendarDate(s.surveyedOn)}: {formatEdr(s.totalEdrSqFt)} EDR{s.surveyedBy && `, ${s.surveyedBy}`}
                  </li>
                ))}
              </ul>
            </section>
          )}
        </>
      ) : (
        boiler && <p>No radiation survey yet.</p>
      )}
    </Page>
  );
}

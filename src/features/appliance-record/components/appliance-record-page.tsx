import { lazy, Suspense, useEffect } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Page, Spinner } from '@/components/ui/page';
import { Notice } from '@/components/ui/notice';
import { useMe } from '@/lib/auth';
import { ApiError } from '@/lib/api-client';
import { can } from '@shared/policy';
import { todayInTimeZone } from '@shared/dates';
import { LABELS } from '@shared/schemas/enums';
import { provenanceWords } from '@shared/transfers/provenance-words';
import { useApplianceRecord } from '@/lib/resources/appliances';
import { applianceTitle, formatDate } from '../lib/labels';
import { bookingWindowWords } from '../lib/booking-words';
import { bookingHref } from '@/lib/booking-link';
import { CombustionTrend } from './combustion-trend';
import { ComponentsList } from './components-list';
import { DueList } from './due-list';
import { EndOfLife } from './end-of-life';
import type { ReactNode } from 'react';
import { RecordHeader } from './record-header';
import { StartVisit } from './start-visit';
import { Timeline } from './timeline';

// Below the first screen, with their form schemas: fetched once the record has painted, not before it.
const MakeupWaterSection = lazy(async () => ({ default: (await import('./makeup-water-section')).MakeupWaterSection }));
const ShareLinksSection = lazy(async () => ({ default: (await import('./share-links-section')).ShareLinksSection }));
const RecordTransferSection = lazy(async () => ({ default: (await import('./record-transfer-section')).RecordTransferSection }));

/** Sections owned by other features (tags, photos) are handed in by the app's router, so features stay independent. */
export type RecordSlots = {
  photos?: (applianceId: string) => ReactNode;
  tag?: (applianceId: string) => ReactNode;
  /** The history of changes (owners and managers; the slot shows nothing to anyone else). */
  changes?: (applianceId: string) => ReactNode;
};

export function ApplianceRecordPage({ slots = {} }: { slots?: RecordSlots }) {
  const { id = '' } = useParams();
  const record = useApplianceRecord(id);
  const me = useMe();
  // Arriving from a long visit form: start at the top, where the unsafe notice and the summary are.
  useEffect(() => {
    window.scrollTo(0, 0);
  }, [id]);

  // Paused: no signal, and this phone has not saved the record (the round saves its records when opened with signal).
  if (record.isPending && record.fetchStatus === 'paused') {
    return (
      <Page title="Life record">
        <Notice kind="caution" title="No signal">
          This life record is not saved on this phone. It opens by itself when signal returns; records on your round are saved
          when you open the round with signal.
        </Notice>
      </Page>
    );
  }
  if (record.isPending) return <Spinner label="Loading the life record…" />;
  if (record.isError) {
    return (
      <Page title="Life record">
        {record.error instanceof ApiError && record.error.status === 404 ? (
          <Notice kind="danger" title="Not found">
            There is no appliance at this address in your company&apos;s records.
          </Notice>
        ) : (
          <Notice kind="danger" title="Not loaded">
            {record.error.message}
          </Notice>
        )}
      </Page>
    );
  }
  const r = record.data;
  const a = r.appliance;
  return (
    <Page title={applianceTitle(a)} subtitle={`${r.customer.name} · ${r.site.street}, ${r.site.town}`}>
      {r.unsafe && (
        <Notice kind="danger" title={`Shut down as unsafe on ${formatDate(r.unsafe.visitedOn)}`}>
          {r.unsafe.reason ?? 'No reason recorded.'} Do not relight until the fault is corrected; follow the manufacturer&apos;s instructions, local codes
          and licensed practice.
        </Notice>
      )}
      {r.transferredFrom && (
        <Notice title="Copied from another company">
          {provenanceWords(r.transferredFrom, me.data?.company?.timeZone ?? 'UTC')}, with the homeowner&apos;s consent. Visits before that day were not made by
          your team.
        </Notice>
      )}
      {a.status !== 'in_service' && <Notice title={LABELS.applianceStatus[a.status]}>This appliance is marked {LABELS.applianceStatus[a.status].toLowerCase()}.</Notice>}
      {r.nextBooking && (
        <p className="font-semibold">
          Next booked visit: {bookingWindowWords(r.nextBooking)}
        </p>
      )}
      {can(me.data?.principal, 'bookings:book') && a.status !== 'removed' && (
        <Link
          className="no-print inline-flex min-h-tap items-center font-semibold underline"
          to={bookingHref({ applianceIds: [a.id], source: can(me.data?.principal, 'bookings:manage') ? 'life_record' : 'follow_up' })}
        >
          {can(me.data?.principal, 'bookings:manage') ? 'Book a visit' : 'Book a follow-up visit'}
        </Link>
      )}
      {can(me.data?.principal, 'visits:record') && a.status !== 'removed' && <StartVisit applianceId={a.id} openDraftVisitId={r.openDraftVisitId} booking={r.nextBooking} />}
      <DueList due={r.due} today={todayInTimeZone(me.data?.company?.timeZone ?? 'UTC')} />
      <RecordHeader record={r} />
      <EndOfLife endOfLife={r.endOfLife} ageYears={r.ageYears} />
      {(a.kind === 'steam_boiler' || a.kind === 'hot_water_boiler') && (
        <Link className="no-print inline-flex min-h-tap items-center font-semibold underline" to={`/appliances/${a.id}/radiation-survey`}>
          Radiation survey (sizing a replacement)
        </Link>
      )}
      <ComponentsList components={r.components} />
      {slots.tag?.(a.id)}
      {slots.photos?.(a.id)}
      <CombustionTrend applianceId={a.id} />
      {a.kind === 'steam_boiler' && (
        <Suspense fallback={null}>
          <MakeupWaterSection applianceId={a.id} timeZone={me.data?.company?.timeZone ?? 'UTC'} canRecord={can(me.data?.principal, 'visits:record') && a.status !== 'removed'} />
        </Suspense>
      )}
      <Timeline applianceId={a.id} />
      {slots.changes?.(a.id)}
      {can(me.data?.principal, 'share:create') && (
        <Suspense fallback={null}>
          <ShareLinksSection applianceId={a.id} canRevoke={can(me.data?.principal, 'share:revoke')} timeZone={me.data?.company?.timeZone ?? 'UTC'} />
        </Suspense>
      )}
      {can(me.data?.principal, 'records:transfer') && (
        <Suspense fallback={null}>
          <RecordTransferSection applianceId={a.id} timeZone={me.data?.company?.timeZone ?? 'UTC'} />
        </Suspense>
      )}
    </Page>
  );
}

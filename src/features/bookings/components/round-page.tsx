import { useState } from 'react';
import { Link } from 'react-router-dom';
import { BOOKING_STATUS_LABELS, type BookingDto, type LoadListDto, type RoundDto } from '@shared/schemas/bookings';
import { todayInTimeZone } from '@shared/dates';
import { formatCalendarDate, formatClockTime } from '@shared/format/dates';
import { addDays } from '@shared/trade/iso-date';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { Page, Spinner } from '@/components/ui/page';
import { useMe } from '@/lib/auth';
import { useSavedForOffline } from '@/lib/offline/use-saved-for-offline';
import { useRound } from '../api/get-round';
import { NoAccessForm } from './no-access-form';

const clock = (local: string) => local.slice(11, 16);

/** The technician's day: bookings in time order with address, access notes, what is due, and the parts to load. */
export function RoundPage() {
  const me = useMe();
  // The company's day, not the phone's: a round is booked on the office's calendar.
  const today = todayInTimeZone(me.data?.company?.timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone);
  const [day, setDay] = useState<'today' | 'tomorrow'>('today');
  const date = day === 'today' ? today : addDays(today, 1);
  const round = useRound(date);
  return (
    <Page title="Round" subtitle={formatCalendarDate(date, { long: true })}>
      <div className="flex gap-2" role="group" aria-label="Which day">
        <Button variant={day === 'today' ? 'primary' : 'secondary'} onClick={() => setDay('today')} aria-pressed={day === 'today'}>
          Today
        </Button>
        <Button variant={day === 'tomorrow' ? 'primary' : 'secondary'} onClick={() => setDay('tomorrow')} aria-pressed={day === 'tomorrow'}>
          Tomorrow
        </Button>
      </div>
      {round.isPending ? (
        <Spinner />
      ) : round.error ? (
        <Notice kind="caution" title="The round could not be loaded">
          {round.error.message}
        </Notice>
      ) : (
        <>
          <SavedForOffline round={round.data} updatedAt={round.dataUpdatedAt} timeZone={me.data?.company?.timeZone} />
          {round.data.bookings.length === 0 ? <p>Nothing booked for this day.</p> : round.data.bookings.map((b) => <BookingCard key={b.id} booking={b} />)}
          <LoadList list={round.data.loadList} />
        </>
      )}
    </Page>
  );
}

/** What this phone holds for a basement with no signal, and from when. */
function SavedForOffline({ round, updatedAt, timeZone }: { round: RoundDto; updatedAt: number; timeZone?: string }) {
  const ids = [...new Set(round.bookings.flatMap((b) => b.appliances.map((a) => a.id)))];
  const { saved, online } = useSavedForOffline(ids);
  const at = formatClockTime(new Date(updatedAt), timeZone);
  if (!online) {
    return (
      <p role="status" className="rounded-plate bg-iron px-3 py-2 font-semibold text-plate" data-saved-for-offline>
        No signal: showing what was saved at {at}.
      </p>
    );
  }
  if (ids.length === 0) return null;
  return (
    <p role="status" className="text-sm font-semibold" data-saved-for-offline>
      Saved for offline: {saved === 1 ? '1 record' : `${saved} records`}, updated {at}.
    </p>
  );
}

function BookingCard({ booking: b }: { booking: BookingDto }) {
  return (
    <Card title={`${clock(b.start)}–${clock(b.end)} · ${b.customer.name}`}>
      <p className="font-semibold">
        {b.site.street}, {b.site.town}
      </p>
      <p className="text-sm">{BOOKING_STATUS_LABELS[b.status]}</p>
      {b.site.accessNotes && <p className="text-sm">Access: {b.site.accessNotes}</p>}
      {b.note && <p className="text-sm">Note from the office: {b.note}</p>}
      {b.customer.phone && (
        <a className="inline-flex min-h-tap items-center underline" href={`tel:${b.customer.phone}`}>
          Call {b.customer.phone}
        </a>
      )}
      <ul className="mt-2 space-y-2">
        {b.appliances.map((a) => (
          <li key={a.id}>
            <Link className="inline-flex min-h-tap items-center font-semibold underline" to={`/appliances/${a.id}`}>
              {a.title}
            </Link>
            <p className="text-sm">
              {a.lastVisitOn ? `Last visit ${formatCalendarDate(a.lastVisitOn)}${a.lastOutcome === 'shut_down_unsafe' ? ', left shut down as unsafe' : ''}` : 'No visit recorded yet'}
            </p>
            {a.due.length > 0 && (
              <ul className="list-disc pl-5 text-sm">
                {a.due.map((d) => (
                  <li key={d}>{d}</li>
                ))}
              </ul>
            )}
          </li>
        ))}
      </ul>
      {(b.status === 'booked' || b.status === 'confirmed') && <NoAccessForm bookingId={b.id} />}
      {b.statusReason && <p className="text-sm">Reason: {b.statusReason}</p>}
    </Card>
  );
}

function LoadList({ list }: { list: LoadListDto }) {
  return (
    <Card title="Load list">
      {list.lines.length === 0 ? (
        <p>No parts due at today’s booked appliances.</p>
      ) : (
        <ul className="space-y-1">
          {list.lines.map((l) => (
            <li key={l.specKey}>
              <span className="font-semibold">
                {l.label} × {l.count}
              </span>{' '}
              <span className="text-sm">({l.reasons.map((r) => (r === 'age' ? 'by age' : 'failed at a check')).join(', ')})</span>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}

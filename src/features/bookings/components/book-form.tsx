import { useState, type FormEvent } from 'react';
import { addMinutesToLocal, BOOKING_STATUS_LABELS, DEFAULT_BOOKING_MINUTES, type BookingDto, type BookingMinutesSetting, type BookingSource } from '@shared/schemas/bookings';
import type { ApplianceKind } from '@shared/schemas/enums';
import { formatCalendarDate } from '@shared/format/dates';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { useTechnicians } from '@/lib/resources/members';
import { describeFailure } from '@/lib/form-errors';
import { useCreateBooking } from '../api/create-booking';
import { useRound } from '../api/get-round';

export type BookFormProps = {
  appliances: { id: string; title: string; kind: ApplianceKind }[];
  siteId: string;
  /** The site's assigned technician, if any; else the first technician is proposed. */
  defaultTechnicianId?: string | null;
  /** The company's window lengths by kind; our defaults until it sets its own. */
  bookingMinutes?: BookingMinutesSetting;
  defaultDate: string;
  source?: BookingSource;
  /** Which of the site's appliances start ticked (default: all of them). */
  initiallyChosen?: string[];
  /** A technician books follow-ups for themselves only: the form offers no one else. */
  onlyTechnicianId?: string;
  /** The homeowner's request this booking answers (it is then marked scheduled). */
  serviceRequestId?: string;
  onBooked: (booking: BookingDto) => void;
  onCancel?: () => void;
};

const clock = (local: string) => local.slice(11, 16);

/** Books one or more appliances at one site; shows the chosen technician's round that day so gaps are visible. */
export function BookForm({
  appliances,
  siteId: _siteId,
  defaultTechnicianId,
  bookingMinutes = DEFAULT_BOOKING_MINUTES,
  defaultDate,
  source = 'due_list',
  initiallyChosen,
  onlyTechnicianId,
  serviceRequestId,
  onBooked,
  onCancel,
}: BookFormProps) {
  const team = useTechnicians();
  const technicians = { ...team, data: onlyTechnicianId ? team.data?.filter((t) => t.userId === onlyTechnicianId) : team.data };
  const [chosen, setChosen] = useState<string[]>(initiallyChosen?.filter((id) => appliances.some((a) => a.id === id)) ?? appliances.map((a) => a.id));
  const [technicianId, setTechnicianId] = useState<string>(defaultTechnicianId ?? '');
  const tech = technicianId || technicians.data?.[0]?.userId || '';
  const [date, setDate] = useState(defaultDate);
  const [time, setTime] = useState('09:00');
  const longest = Math.max(...appliances.filter((a) => chosen.includes(a.id)).map((a) => bookingMinutes[a.kind] ?? DEFAULT_BOOKING_MINUTES[a.kind]), 0);
  const [minutes, setMinutes] = useState<string>('');
  const length = Number(minutes || longest);
  const round = useRound(date, tech || undefined);
  const create = useCreateBooking();
  const failure = create.error ? describeFailure(create.error) : null;

  function submit(e: FormEvent) {
    e.preventDefault();
    const start = `${date}T${time}`;
    // mutateAsync: the refetch after the booking removes this item from the queue, unmounting the form before mutate's own callback would run.
    create.mutateAsync({ applianceIds: chosen, technicianId: tech, start, end: addMinutesToLocal(start, length), source, ...(serviceRequestId ? { serviceRequestId } : {}) }).then(onBooked, () => undefined);
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-3" aria-label="Book a visit">
      <fieldset className="flex flex-col gap-1">
        <legend className="text-sm font-semibold">Appliances at this site</legend>
        {appliances.map((a) => (
          <label key={a.id} className="flex min-h-tap items-center gap-2">
            <input
              type="checkbox"
              checked={chosen.includes(a.id)}
              onChange={(e) => setChosen((c) => (e.target.checked ? [...c, a.id] : c.filter((id) => id !== a.id)))}
            />
            {a.title}
          </label>
        ))}
      </fieldset>
      <SelectField label="Technician" value={tech} onChange={(e) => setTechnicianId(e.target.value)} error={failure?.fields.technicianId}>
        {(technicians.data ?? []).map((t) => (
          <option key={t.userId} value={t.userId}>
            {t.name}
          </option>
        ))}
      </SelectField>
      <TextField label="Date" type="date" value={date} onChange={(e) => setDate(e.target.value)} required />
      <TextField label="Start time" type="time" value={time} onChange={(e) => setTime(e.target.value)} required error={failure?.fields.start} />
      <TextField
        label="Window (minutes)"
        type="number"
        min={15}
        step={15}
        value={minutes || String(longest)}
        onChange={(e) => setMinutes(e.target.value)}
        error={failure?.fields.end}
      />
      <section aria-label="That day's round">
        <h3 className="text-sm font-semibold">Already booked on {formatCalendarDate(date)}</h3>
        {round.data?.bookings.length ? (
          <ul className="text-sm">
            {round.data.bookings.map((b) => (
              <li key={b.id}>
                {clock(b.start)}–{clock(b.end)} · {b.customer.name}, {b.site.town} · {BOOKING_STATUS_LABELS[b.status]}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm">{round.isPending ? 'Loading…' : 'Nothing yet: the day is free.'}</p>
        )}
      </section>
      {failure && (
        <Notice kind="caution" title="Not booked">
          {failure.fields.start?.[0] ?? failure.message}
        </Notice>
      )}
      <div className="flex gap-2">
        <Button type="submit" disabled={create.isPending || !chosen.length || !tech}>
          Book visit
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel}>
            Close
          </Button>
        )}
      </div>
    </form>
  );
}

import { useState, type FormEvent } from 'react';
import { addMinutesToLocal, localMinutesBetween, type BookingDto } from '@shared/schemas/bookings';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { describeFailure } from '@/lib/form-errors';
import { useMoveBooking } from '../api/move-booking';

/** Moves a booking by keyboard alone: date, start time and technician; the window keeps its length. */
export function MoveForm({ booking, technicians, onMoved }: { booking: BookingDto; technicians: { id: string; name: string }[]; onMoved: () => void }) {
  const [date, setDate] = useState(booking.start.slice(0, 10));
  const [time, setTime] = useState(booking.start.slice(11, 16));
  const [technicianId, setTechnicianId] = useState(booking.technician.id);
  const move = useMoveBooking();
  const failure = move.error ? describeFailure(move.error) : null;
  const length = localMinutesBetween(booking.start, booking.end);

  function submit(e: FormEvent) {
    e.preventDefault();
    const start = `${date}T${time}`;
    move.mutateAsync({ id: booking.id, input: { start, end: addMinutesToLocal(start, length), technicianId } }).then(onMoved, () => undefined);
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-3" aria-label={`Move the booking for ${booking.customer.name}`}>
      <TextField label="New date" type="date" value={date} onChange={(e) => setDate(e.target.value)} required error={failure?.fields.start} />
      <TextField label="New start time" type="time" value={time} onChange={(e) => setTime(e.target.value)} required />
      <SelectField label="Technician" value={technicianId} onChange={(e) => setTechnicianId(e.target.value)} error={failure?.fields.technicianId}>
        {technicians.map((t) => (
          <option key={t.id} value={t.id}>
            {t.name}
          </option>
        ))}
      </SelectField>
      {failure && (
        <Notice kind="caution" title="Not moved">
          {move.error && 'code' in move.error && move.error.code === 'booking_clash' ? move.error.message : failure.message}
        </Notice>
      )}
      <Button type="submit" disabled={move.isPending}>
        Move booking
      </Button>
    </form>
  );
}

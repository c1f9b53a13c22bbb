import { useState } from 'react';
import { DndContext, KeyboardSensor, PointerSensor, useDraggable, useDroppable, useSensor, useSensors, type DragEndEvent } from '@dnd-kit/core';
import { addMinutesToLocal, BOOKING_STATUS_LABELS, localMinutesBetween, type BookingDto } from '@shared/schemas/bookings';
import { todayInTimeZone } from '@shared/dates';
import { formatCalendarDate, formatWeekday } from '@shared/format/dates';
import { addDays, mondayOf } from '@shared/trade/iso-date';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Page, Spinner } from '@/components/ui/page';
import { useMe } from '@/lib/auth';
import { describeFailure } from '@/lib/form-errors';
import { useWeekBoard } from '../api/get-week-board';
import { useMoveBooking } from '../api/move-booking';
import { MoveForm } from './move-form';
import { UnbookedQueue } from './unbooked-queue';

const clock = (local: string) => local.slice(11, 16);
const cellId = (technicianId: string, date: string) => `${technicianId}|${date}`;

const BOARD_DUE_LINES = 2;
const shownDue = (due: string[]) => [...due].sort((a, b) => Number(b.includes(': replace')) - Number(a.includes(': replace'))).slice(0, BOARD_DUE_LINES);

/** The office's week: technicians as rows, Monday to Saturday across, bookings as blocks; the unbooked queue beside. */
export function WeekBoardPage() {
  const me = useMe();
  const today = todayInTimeZone(me.data?.company?.timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone);
  const [monday, setMonday] = useState(() => mondayOf(today));
  const sunday = addDays(monday, 6);
  // Monday to Saturday; Sunday too when something is booked on it, so no booking is ever off the board.
  const board = useWeekBoard(monday, sunday);
  const sundayBooked = board.data?.bookings.some((b) => b.start.slice(0, 10) === sunday) ?? false;
  const days = [0, 1, 2, 3, 4, 5, ...(sundayBooked ? [6] : [])].map((n) => addDays(monday, n));
  const [moving, setMoving] = useState<string | null>(null);
  const drag = useMoveBooking();
  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 6 } }), useSensor(KeyboardSensor));
  const dragFailure = drag.error ? describeFailure(drag.error) : null;

  function onDragEnd(e: DragEndEvent) {
    const booking = board.data?.bookings.find((b) => b.id === e.active.id);
    if (!booking || !e.over) return;
    const [technicianId, date] = String(e.over.id).split('|');
    if (technicianId === booking.technician.id && date === booking.start.slice(0, 10)) return;
    const start = `${date}T${clock(booking.start)}`;
    drag.mutate({ id: booking.id, input: { start, end: addMinutesToLocal(start, localMinutesBetween(booking.start, booking.end)), technicianId } });
  }

  const movingBooking = board.data?.bookings.find((b) => b.id === moving);
  return (
    <Page wide title="Week board" subtitle={`${formatCalendarDate(days[0])} to ${formatCalendarDate(days.at(-1)!)}`}>
      <div className="flex flex-wrap gap-2" role="group" aria-label="Which week">
        <Button variant="secondary" onClick={() => setMonday(addDays(monday, -7))}>
          Previous week
        </Button>
        <Button variant="secondary" onClick={() => setMonday(mondayOf(today))} aria-pressed={monday === mondayOf(today)}>
          This week
        </Button>
        <Button variant="secondary" onClick={() => setMonday(addDays(monday, 7))}>
          Next week
        </Button>
      </div>
      <div className="grid gap-4 lg:grid-cols-[1fr_20rem]">
        <div className="flex flex-col gap-3">
          {dragFailure && (
            <Notice kind="caution" title="Not moved">
              {dragFailure.message}
            </Notice>
          )}
          {board.isPending ? (
            <Spinner />
          ) : board.error ? (
            <Notice kind="caution" title="The week could not be loaded">
              {board.error.message}
            </Notice>
          ) : (
            <DndContext sensors={sensors} onDragEnd={onDragEnd}>
              <table className="w-full table-fixed border-collapse text-sm" aria-label="Week board">
                <thead>
                  <tr>
                    <th scope="col" className="w-32 p-2 text-left">
                      Technician
                    </th>
                    {days.map((d) => (
                      <th key={d} scope="col" className={`p-2 text-left ${d === today ? 'underline' : ''}`}>
                        {formatWeekday(d)}
                        {d === today && <span className="sr-only"> (today)</span>}
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {board.data.technicians.map((t) => (
                    <tr key={t.id}>
                      <th scope="row" className="p-2 text-left align-top">
                        {t.name}
                      </th>
                      {days.map((d) => (
                        <DayCell key={d} id={cellId(t.id, d)} label={`${t.name}, ${formatWeekday(d)}`}>
                          {board.data.bookings
                            .filter((b) => b.technician.id === t.id && b.start.slice(0, 10) === d)
                            .map((b) => (
                              <BookingBlock key={b.id} booking={b} onMove={() => setMoving(b.id)} />
                            ))}
                        </DayCell>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            </DndContext>
          )}
          {movingBooking && board.data && (
            <section aria-labelledby="move-heading" className="rounded-plate border-2 border-plate-line bg-surface p-3">
              <h2 id="move-heading" className="text-lg font-bold">
                Move: {movingBooking.customer.name}, {formatCalendarDate(movingBooking.start.slice(0, 10))} {clock(movingBooking.start)}
              </h2>
              <MoveForm key={movingBooking.id} booking={movingBooking} technicians={board.data.technicians} onMoved={() => setMoving(null)} />
              <Button variant="ghost" onClick={() => setMoving(null)}>
                Close
              </Button>
            </section>
          )}
        </div>
        <UnbookedQueue from={days[0]} to={days.at(-1)!} today={today} />
      </div>
    </Page>
  );
}

function DayCell({ id, label, children }: { id: string; label: string; children: React.ReactNode }) {
  const { setNodeRef, isOver } = useDroppable({ id });
  return (
    <td ref={setNodeRef} aria-label={label} className={`h-24 border border-plate-line p-1 align-top ${isOver ? 'bg-plate-deep' : ''}`}>
      <div className="flex flex-col gap-1">{children}</div>
    </td>
  );
}

function BookingBlock({ booking: b, onMove }: { booking: BookingDto; onMove: () => void }) {
  const { attributes, listeners, setNodeRef, transform } = useDraggable({ id: b.id, disabled: b.status !== 'booked' && b.status !== 'confirmed' });
  const style = transform ? { transform: `translate(${transform.x}px, ${transform.y}px)` } : undefined;
  const due = b.appliances.flatMap((a) => a.due);
  return (
    <article
      ref={setNodeRef}
      style={style}
      className={`rounded-plate border-2 bg-surface p-1 ${b.status === 'cancelled' || b.status === 'no_access' ? 'border-dashed border-plate-line opacity-80' : 'border-iron'}`}
      aria-label={`${b.customer.name}, ${clock(b.start)} to ${clock(b.end)}`}
    >
      <div {...listeners} {...attributes} aria-roledescription="draggable booking" className="cursor-grab">
        <p className="font-semibold">
          {clock(b.start)}–{clock(b.end)}
        </p>
        <p>{b.customer.name}</p>
        <p>{b.site.town}</p>
        <p className="text-xs font-semibold uppercase">{BOOKING_STATUS_LABELS[b.status]}</p>
        {due.length > 0 && (
          // A block stays a glance: replacements first, two lines, the rest counted (the round and the record list them all).
          <p className="text-xs">
            {shownDue(due).join('; ')}
            {due.length > BOARD_DUE_LINES && ` and ${due.length - BOARD_DUE_LINES} more`}
          </p>
        )}
      </div>
      {(b.status === 'booked' || b.status === 'confirmed') && (
        <button type="button" className="min-h-tap text-xs underline" onClick={onMove} aria-label={`Move ${b.customer.name}, ${clock(b.start)}`}>
          Move
        </button>
      )}
    </article>
  );
}

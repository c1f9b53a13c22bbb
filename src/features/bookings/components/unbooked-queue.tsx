import { useState } from 'react';
import { APPLIANCE_KINDS, FUELS, LABELS, type ApplianceKind, type Fuel } from '@shared/schemas/enums';
import type { UnbookedItemDto } from '@shared/schemas/bookings';
import { formatCalendarDate } from '@shared/format/dates';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { Spinner } from '@/components/ui/page';
import { useUnbooked } from '../api/get-unbooked';
import { BookForm } from './book-form';

/** Beside the week board: what is due by the week's end and not booked yet, each with a Book button. */
export function UnbookedQueue({ from, to, today }: { from: string; to: string; today: string }) {
  const [applianceKind, setKind] = useState<ApplianceKind | ''>('');
  const [fuel, setFuel] = useState<Fuel | ''>('');
  const [search, setSearch] = useState('');
  const [booking, setBooking] = useState<string | null>(null);
  const [booked, setBooked] = useState<string | null>(null);
  const queue = useUnbooked({ from, to, applianceKind: applianceKind || undefined, fuel: fuel || undefined, search: search.trim() || undefined });
  const all = queue.data?.items ?? [];
  const sameSite = (item: UnbookedItemDto) => all.filter((i) => i.site.id === item.site.id);

  return (
    <section aria-labelledby="unbooked-heading" className="flex flex-col gap-3">
      <h2 id="unbooked-heading" className="text-lg font-bold">
        Not booked yet
      </h2>
      <div className="grid grid-cols-2 gap-2">
        <SelectField label="Kind" value={applianceKind} onChange={(e) => setKind(e.target.value as ApplianceKind | '')}>
          <option value="">All kinds</option>
          {APPLIANCE_KINDS.map((k) => (
            <option key={k} value={k}>
              {LABELS.applianceKind[k]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Fuel" value={fuel} onChange={(e) => setFuel(e.target.value as Fuel | '')}>
          <option value="">All fuels</option>
          {FUELS.map((f) => (
            <option key={f} value={f}>
              {LABELS.fuel[f]}
            </option>
          ))}
        </SelectField>
      </div>
      <TextField label="Customer, street or town" type="search" value={search} onChange={(e) => setSearch(e.target.value)} />
      {booked && (
        <Notice kind="done" title="Booked">
          {booked}
        </Notice>
      )}
      {queue.isPending ? (
        <Spinner />
      ) : queue.error ? (
        <Notice kind="caution" title="The queue could not be loaded">
          {queue.error.message}
        </Notice>
      ) : all.length === 0 ? (
        <p>Everything due by the week’s end is booked.</p>
      ) : (
        <ul className="flex flex-col gap-2" aria-label="Appliances not booked yet">
          {all.map((item) => (
            <li key={item.appliance.id} className="rounded-plate border-2 border-plate-line bg-surface p-3" aria-label={`${item.customer.name}, ${item.appliance.title}`}>
              <p className="font-semibold">{item.customer.name}</p>
              <p className="text-sm">
                {item.site.street}, {item.site.town} · {item.appliance.title}
              </p>
              <p className="text-sm font-semibold">
                {item.overdue ? 'Overdue' : 'Due'} {formatCalendarDate(item.firstDueOn)}
              </p>
              <ul className="text-sm">
                {item.due.map((d) => (
                  <li key={d}>{d}</li>
                ))}
              </ul>
              {booking === item.appliance.id ? (
                <div className="mt-2">
                  <BookForm
                    appliances={sameSite(item).map((i) => i.appliance)}
                    siteId={item.site.id}
                    defaultTechnicianId={item.site.assignedTechnicianId}
                    bookingMinutes={queue.data.bookingMinutes}
                    defaultDate={from > today ? from : today}
                    onBooked={(b) => {
                      setBooking(null);
                      setBooked(`${b.customer.name}, ${formatCalendarDate(b.start.slice(0, 10))} ${b.start.slice(11, 16)} with ${b.technician.name}.`);
                    }}
                    onCancel={() => setBooking(null)}
                  />
                </div>
              ) : (
                <Button variant="secondary" className="mt-2" onClick={() => setBooking(item.appliance.id)} aria-label={`Book ${item.customer.name}, ${item.appliance.title}`}>
                  Book
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

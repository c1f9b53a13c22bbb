import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { BOOKING_SOURCES, type BookingDto, type BookingSource } from '@shared/schemas/bookings';
import { LABELS } from '@shared/schemas/enums';
import { can } from '@shared/policy';
import { formatCalendarDate } from '@shared/format/dates';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { Page, Spinner } from '@/components/ui/page';
import { useMe } from '@/lib/auth';
import { useApplianceRecord } from '@/lib/resources/appliances';
import { useBookingCompany, useBookingCustomer } from '../api/get-booking-site';
import { BookForm } from './book-form';

const clock = (local: string) => local.slice(11, 16);
const isSource = (v: string | null): v is BookingSource => BOOKING_SOURCES.some((s) => s === v);

/** "Book" from the due list, the annual-service list, a service request or the life record lands here. */
export function BookPage() {
  const [params] = useSearchParams();
  const ids = params.getAll('appliance');
  const asked = params.get('source');
  const source: BookingSource = isSource(asked) ? asked : 'phone';
  const serviceRequestId = params.get('serviceRequest') ?? undefined;
  const me = useMe();
  const office = can(me.data?.principal, 'bookings:plan');
  const record = useApplianceRecord(ids[0] ?? '');
  const customer = useBookingCustomer(record.data?.customer.id ?? '');
  const company = useBookingCompany();
  const [booked, setBooked] = useState<BookingDto | null>(null);

  if (!ids.length) {
    return (
      <Page title="Book a visit">
        <Notice kind="caution" title="Nothing to book">
          Open an appliance, the due list or a service request and choose Book there.
        </Notice>
      </Page>
    );
  }
  if (record.isError) {
    return (
      <Page title="Book a visit">
        <Notice kind="danger" title="Not found">
          There is no appliance at this address in your company&apos;s records.
        </Notice>
      </Page>
    );
  }
  if (record.isPending || customer.isPending || company.isPending) return <Spinner label="Loading the site…" />;
  const r = record.data;
  const site = customer.data?.sites.find((s) => s.id === r.site.id);
  const appliances = (site?.appliances ?? [])
    .filter((a) => a.status !== 'removed')
    .map((a) => ({ id: a.id, kind: a.kind, title: `${LABELS.applianceKind[a.kind]}, ${LABELS.fuel[a.fuel].toLowerCase()}` }));
  const today = company.data?.today ?? new Date().toISOString().slice(0, 10);

  return (
    <Page title="Book a visit" subtitle={`${r.customer.name} · ${r.site.street}, ${r.site.town}`}>
      {booked ? (
        <Notice title="Booked">
          {formatCalendarDate(booked.start.slice(0, 10), { long: true })}, {clock(booked.start)}–{clock(booked.end)} with {booked.technician.name}.{' '}
          {booked.customer.name} is e-mailed the time with a calendar invitation, unless they have no address or asked for no e-mail.
        </Notice>
      ) : (
        <Card>
          <BookForm
            appliances={appliances}
            initiallyChosen={ids}
            siteId={r.site.id}
            defaultTechnicianId={office ? r.site.assignedTechnicianId : (me.data?.user?.id ?? null)}
            onlyTechnicianId={office ? undefined : me.data?.user?.id}
            bookingMinutes={company.data?.bookingMinutes}
            defaultDate={today}
            source={source}
            serviceRequestId={serviceRequestId}
            onBooked={setBooked}
          />
        </Card>
      )}
      <p className="flex flex-wrap gap-4">
        <Link className="inline-flex min-h-tap items-center font-semibold underline" to={`/appliances/${r.appliance.id}`}>
          Back to the life record
        </Link>
        {office && (
          <Link className="inline-flex min-h-tap items-center font-semibold underline" to="/week">
            Open the week board
          </Link>
        )}
      </p>
    </Page>
  );
}

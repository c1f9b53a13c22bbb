import { formatInstant } from '@shared/format/dates';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { bookingHref } from '@/lib/booking-link';
import { StatusBadge, type Status } from '@/components/ui/status-badge';
import { SERVICE_REQUEST_STATUS_LABELS, type ServiceRequestDto, type ServiceRequestStatus } from '@shared/schemas/service-requests';

const BADGE: Record<ServiceRequestStatus, Status> = { new: 'soon', scheduled: 'info', closed: 'ok' };
const when = (iso: string) => formatInstant(iso, Intl.DateTimeFormat().resolvedOptions().timeZone);

export function ServiceRequestCard({
  request: r,
  highlighted,
  busy,
  onStatus,
  canBook = false,
}: {
  request: ServiceRequestDto;
  canBook?: boolean;
  highlighted: boolean;
  busy: boolean;
  onStatus: (status: 'scheduled' | 'closed') => void;
}) {
  return (
    <li
      id={`request-${r.id}`}
      aria-current={highlighted ? 'true' : undefined}
      className={`flex flex-col gap-2 rounded-plate border bg-surface p-4 ${highlighted ? 'border-brass border-2' : 'border-plate-line'}`}
    >
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-lg font-semibold">{r.contactName}</h2>
        <StatusBadge status={BADGE[r.status]}>{SERVICE_REQUEST_STATUS_LABELS[r.status]}</StatusBadge>
      </div>
      <p className="text-sm text-iron-muted">
        {when(r.createdAt)} · {r.via === 'share_link' ? 'through a share link' : r.via === 'booking_reply' ? 'about a booked time that does not suit them' : 'from the homeowner’s sign-in'}
        {r.customerName ? ` · customer: ${r.customerName}` : ''}
      </p>
      <p>
        <Link className="font-semibold underline" to={`/appliances/${r.appliance.id}`}>
          {r.appliance.title}
        </Link>{' '}
        · {r.appliance.address}
      </p>
      <p className="flex flex-wrap gap-x-4">
        {r.contactPhone && (
          <a className="inline-flex min-h-tap items-center underline" href={`tel:${r.contactPhone}`}>
            {r.contactPhone}
          </a>
        )}
        {r.contactEmail && (
          <a className="inline-flex min-h-tap items-center underline" href={`mailto:${r.contactEmail}`}>
            {r.contactEmail}
          </a>
        )}
      </p>
      {r.preferredTimes && <p>Preferred times: {r.preferredTimes}</p>}
      {r.message && <p className="whitespace-pre-wrap">{r.message}</p>}
      {!r.officeNotifiedAt && (
        <p className="text-sm text-iron-muted">
          {r.officeMail === 'queued'
            ? 'The e-mail about this request is queued: the mail server did not answer, and it goes out by itself as soon as it does.'
            : 'The e-mail about this request was not sent; it is only in this list.'}
        </p>
      )}
      {r.booking && <p className="font-semibold">Booked for {when(r.booking.startsAt)}</p>}
      {r.handledAt && (
        <p className="text-sm text-iron-muted">
          Marked {SERVICE_REQUEST_STATUS_LABELS[r.status].toLowerCase()} {when(r.handledAt)}
          {r.handledByName ? ` by ${r.handledByName}` : ''}
        </p>
      )}
      {r.status !== 'closed' && (
        <div className="flex flex-wrap gap-2">
          {r.status === 'new' && canBook && (
            <Link
              className="inline-flex min-h-tap items-center rounded-plate bg-iron px-4 font-semibold text-plate hover:bg-iron-soft"
              to={bookingHref({ applianceIds: [r.appliance.id], source: 'service_request', serviceRequestId: r.id })}
            >
              Book a visit
            </Link>
          )}
          {r.status === 'new' && (
            <Button variant={canBook ? 'secondary' : 'primary'} disabled={busy} onClick={() => onStatus('scheduled')}>
              Mark scheduled
            </Button>
          )}
          <Button variant="secondary" disabled={busy} onClick={() => onStatus('closed')}>
            Mark closed
          </Button>
        </div>
      )}
    </li>
  );
}

import { Link } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { Spinner } from '@/components/ui/page';
import { StatusBadge } from '@/components/ui/status-badge';
import { LABELS } from '@shared/schemas/enums';
import { formatCalendarDate } from '@shared/format/dates';
import { useMe } from '@/lib/auth';
import { can } from '@shared/policy';
import { bookingHref } from '@/lib/booking-link';
import { useAnnualServiceDue } from '../api/get-annual-service-due';
import { useReminders } from '../api/get-reminders';
import { AnnualReminderCell, currentAnnualReminder } from './annual-reminder-cell';

/** Appliances whose yearly tune-up has lapsed, with who to call. */
export function AnnualServiceDue() {
  const due = useAnnualServiceDue();
  const reminders = useReminders(200);
  const me = useMe();
  const canSend = can(me.data?.principal, 'reminders:send');
  const canBook = can(me.data?.principal, 'bookings:manage');
  if (due.isPending) return <Spinner />;
  if (!due.data) return null;
  return (
    <Card title={`Annual service overdue (${due.data.total})`}>
      {!due.data.items.length ? (
        <p>Every appliance in service has had its annual maintenance within the last year.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="tabular w-full text-left text-sm">
            <thead>
              <tr className="border-b-2 border-plate-line whitespace-nowrap">
                <th className="py-2 pr-3">Last annual service</th>
                <th className="pr-3">Appliance</th>
                <th className="pr-3">Customer</th>
                <th className="pr-3">Contact</th>
                <th className="pr-3">Reminder e-mail</th>
                {canBook && <th className="no-print pr-3">Booking</th>}
              </tr>
            </thead>
            <tbody>
              {due.data.items.map((i) => (
                <tr key={i.applianceId} className="border-b border-plate-line whitespace-nowrap">
                  <td className="py-1 pr-3">{i.lastAnnualOn ? formatCalendarDate(i.lastAnnualOn) : <StatusBadge status="due">Never recorded</StatusBadge>}</td>
                  <td className="max-w-[22rem] truncate pr-3" title={`${i.street}, ${i.town}`}>
                    <Link className="inline-flex min-h-tap items-center font-semibold text-brass-dark underline lg:min-h-6" to={`/appliances/${i.applianceId}`}>
                      {LABELS.applianceKind[i.kind]}, {LABELS.fuel[i.fuel].toLowerCase()}
                    </Link>
                    <span className="text-iron-muted">
                      {' '}
                      · {i.street}, {i.town}
                    </span>
                  </td>
                  <td className="pr-3">{i.customer.name}</td>
                  <td className="pr-3">
                    {[i.customer.phone, i.customer.email].filter(Boolean).join(' · ')}
                    {i.customer.remindersOptOut && (
                      <>
                        {' '}
                        <StatusBadge status="info">No reminders</StatusBadge>
                      </>
                    )}
                  </td>
                  <td className="py-1 pr-3">
                    <AnnualReminderCell item={i} reminder={currentAnnualReminder(i, reminders.data?.items)} canSend={canSend} />
                  </td>
                  {canBook && (
                    <td className="no-print py-1 pr-3">
                      <Link className="inline-flex min-h-tap items-center font-semibold underline lg:min-h-6" to={bookingHref({ applianceIds: [i.applianceId], source: 'annual_service' })}>
                        Book<span className="sr-only"> the annual service at {i.street}</span>
                      </Link>
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Card>
  );
}

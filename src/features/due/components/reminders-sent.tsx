import { Link } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { Spinner } from '@/components/ui/page';
import { StatusBadge, type Status } from '@/components/ui/status-badge';
import type { ReminderStatus } from '@shared/schemas/reminders';
import { formatCalendarDate } from '@shared/format/dates';
import { useReminders } from '../api/get-reminders';

const STATUS: Record<ReminderStatus, { look: Status; word: string }> = {
  sent: { look: 'ok', word: 'Sent' },
  pending: { look: 'info', word: 'Sending' },
  failed: { look: 'soon', word: 'Not delivered, will retry' },
  opted_out: { look: 'info', word: 'Opted out' },
  no_email: { look: 'info', word: 'No e-mail on file' },
};

/** The latest reminder e-mails, from the daily run and from the office, newest first. */
export function RemindersSent() {
  const reminders = useReminders(50);
  if (reminders.isPending) return <Spinner />;
  if (!reminders.data) return null;
  return (
    <Card title="Reminders sent">
      {!reminders.data.items.length ? (
        <p>No reminder e-mails yet. The daily run sends them when an annual service or a part falls due.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="tabular w-full text-left text-sm">
            <thead>
              <tr className="border-b-2 border-plate-line whitespace-nowrap">
                <th className="py-2 pr-3">When</th>
                <th className="pr-3">Customer</th>
                <th className="pr-3">About</th>
                <th className="pr-3">Due</th>
                <th className="pr-3">Outcome</th>
              </tr>
            </thead>
            <tbody>
              {reminders.data.items.map((r) => (
                <tr key={r.id} className="border-b border-plate-line whitespace-nowrap">
                  <td className="py-1 pr-3">{formatCalendarDate((r.sentAt ?? r.createdAt).slice(0, 10))}</td>
                  <td className="pr-3">
                    {r.customerName}
                    {r.toEmail && <span className="text-iron-muted"> · {r.toEmail}</span>}
                  </td>
                  <td className="pr-3">
                    <Link className="inline-flex min-h-tap items-center font-semibold text-brass-dark underline lg:min-h-6" to={`/appliances/${r.applianceId}`}>
                      {r.kind === 'annual_service' ? 'Annual service' : (r.partLabel ?? 'Part due')}
                    </Link>
                    <span className="text-iron-muted"> · {r.trigger === 'office' ? 'sent by the office' : 'daily run'}</span>
                  </td>
                  <td className="pr-3">{formatCalendarDate(r.dueOn)}</td>
                  <td className="pr-3">
                    <StatusBadge status={STATUS[r.status].look}>{STATUS[r.status].word}</StatusBadge>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Card>
  );
}

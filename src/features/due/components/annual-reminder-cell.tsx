import { Button } from '@/components/ui/button';
import { StatusBadge } from '@/components/ui/status-badge';
import { ApiError } from '@/lib/api-client';
import { formatCalendarDate } from '@shared/format/dates';
import type { AnnualServiceDueItem } from '@shared/schemas/fleet';
import type { ReminderDto } from '@shared/schemas/reminders';
import { useSendAnnualReminder } from '../api/send-annual-reminder';

/** A reminder for the current period: due after the last annual visit (or any, if there never was one). */
export function currentAnnualReminder(item: AnnualServiceDueItem, reminders: ReminderDto[] | undefined) {
  return reminders?.find((r) => r.applianceId === item.applianceId && r.kind === 'annual_service' && (!item.lastAnnualOn || r.dueOn > item.lastAnnualOn));
}

/** The state of this period's reminder e-mail and, for those who may, the button that sends it. */
export function AnnualReminderCell({ item, reminder, canSend }: { item: AnnualServiceDueItem; reminder?: ReminderDto; canSend: boolean }) {
  const send = useSendAnnualReminder();
  const shown = send.data ?? reminder;
  if (item.customer.remindersOptOut) return <StatusBadge status="info">Opted out</StatusBadge>;
  if (shown?.status === 'sent') return <StatusBadge status="ok">{shown.sentAt ? `Reminder sent ${formatCalendarDate(shown.sentAt.slice(0, 10))}` : 'Reminder sent'}</StatusBadge>;
  if (!item.customer.email) return <span className="text-sm text-iron-muted">No e-mail on file</span>;
  return (
    <div className="flex items-center gap-2">
      {shown?.status === 'failed' && <StatusBadge status="soon">Not delivered yet</StatusBadge>}
      {canSend && (
        <Button variant="secondary" className="lg:min-h-6 lg:py-0.5 lg:text-sm" disabled={send.isPending} onClick={() => send.mutate(item.applianceId)}>
          {send.isPending ? 'Sending…' : 'Send reminder'}
        </Button>
      )}
      {send.error && (
        <p role="alert" className="text-sm text-due">
          {send.error instanceof ApiError ? send.error.message : 'The reminder could not be sent.'}
        </p>
      )}
    </div>
  );
}

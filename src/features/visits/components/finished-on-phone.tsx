import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Page } from '@/components/ui/page';
import type { OutboxEntry } from '@/lib/offline/outbox';
import { useMe } from '@/lib/auth';
import { formatClockTime } from '@shared/format/dates';
import { LABELS } from '@shared/schemas/enums';
import type { VisitDto } from '@shared/schemas/visits';

/** A visit finished with no signal: nothing more to do here; it goes to the office by itself when signal returns. */
export function FinishedOnPhone({ visit, entry, onSendNow }: { visit: VisitDto; entry: OutboxEntry; onSendNow: () => void }) {
  const timeZone = useMe().data?.company?.timeZone;
  return (
    <Page title={LABELS.visitType[visit.type]} subtitle={<Link to={`/appliances/${visit.applianceId}`} className="underline">Back to the life record</Link>}>
      <Notice kind="caution" title="Finished on this phone">
        <p role="status">
          Finished at {formatClockTime(new Date(entry.queuedAt).toISOString(), timeZone)} with no signal. It is kept on this phone and goes to the office
          by itself as soon as there is signal; you can close the app.
        </p>
      </Notice>
      <Button variant="secondary" onClick={onSendNow}>
        Try sending now
      </Button>
    </Page>
  );
}

/** The office refused a completion sent from the outbox: say why, and let the technician correct it and finish again. */
export function RefusedFinish({ entry, onCorrect }: { entry: OutboxEntry; onCorrect: () => void }) {
  const details = Object.entries(entry.refusal?.details ?? {});
  return (
    <Notice kind="danger" title="The office did not accept this visit">
      <p>{entry.refusal?.message}</p>
      {details.length > 0 && (
        <ul className="list-disc pl-5">
          {details.map(([field, messages]) => (
            <li key={field}>{messages.join(' ')}</li>
          ))}
        </ul>
      )}
      <p>Everything you typed is still on this phone.</p>
      <Button className="mt-2" onClick={onCorrect}>
        Correct the visit
      </Button>
    </Notice>
  );
}

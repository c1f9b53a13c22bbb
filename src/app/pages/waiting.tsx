import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Page } from '@/components/ui/page';
import { useMe } from '@/lib/auth';
import { useOutbox } from '@/lib/offline/offline-session';
import type { OutboxEntry } from '@/lib/offline/outbox';
import { formatInstant } from '@shared/format/dates';

/** Everything recorded on this phone that the office does not have yet, in the order it will be sent. */
export function WaitingPage() {
  const { outbox, snapshot } = useOutbox();
  const timeZone = useMe().data?.company?.timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone;
  return (
    <Page title="Waiting to send" subtitle="Kept on this phone until the office has it; sent by itself when there is signal.">
      {snapshot.entries.length === 0 ? (
        <p>Nothing is waiting: the office has everything recorded on this phone.</p>
      ) : (
        <ol className="flex flex-col gap-3">
          {snapshot.entries.map((e) => (
            <li key={e.seq}>
              <WaitingEntry entry={e} timeZone={timeZone} onDiscard={() => void outbox?.discard(e.seq)} />
            </li>
          ))}
        </ol>
      )}
      {outbox && snapshot.entries.some((e) => e.state === 'waiting') && (
        <Button onClick={outbox.retryNow} disabled={snapshot.sending}>
          {snapshot.sending ? 'Sending…' : 'Send now'}
        </Button>
      )}
    </Page>
  );
}

function WaitingEntry({ entry: e, timeZone, onDiscard }: { entry: OutboxEntry; timeZone: string; onDiscard: () => void }) {
  const [confirming, setConfirming] = useState(false);
  const details = Object.values(e.refusal?.details ?? {}).flat();
  return (
    <Card title={e.label}>
      <p className="text-sm">Recorded {formatInstant(new Date(e.queuedAt), timeZone)}</p>
      {e.state === 'waiting' ? (
        <p className="font-semibold">Waiting for signal{e.attempts > 0 ? ` (tried ${e.attempts === 1 ? 'once' : `${e.attempts} times`})` : ''}.</p>
      ) : (
        <div className="flex flex-col gap-1 rounded-plate bg-due-soft p-2 text-due">
          <p className="font-semibold">Not accepted: {e.refusal?.message}</p>
          {details.length > 0 && (
            <ul className="list-disc pl-5">
              {details.map((d) => (
                <li key={d}>{d}</li>
              ))}
            </ul>
          )}
          <p className="text-iron">Later changes of this visit wait behind it. Open the visit to correct it, or discard this change.</p>
        </div>
      )}
      <div className="flex flex-wrap gap-2">
        {e.visitId && (
          <Link to={`/visits/${e.visitId}`} className="inline-flex min-h-tap items-center font-semibold underline">
            Open the visit
          </Link>
        )}
        {e.state === 'refused' &&
          (confirming ? (
            <>
              <Button variant="secondary" onClick={onDiscard}>
                Discard it from this phone
              </Button>
              <Button variant="ghost" onClick={() => setConfirming(false)}>
                Keep it
              </Button>
            </>
          ) : (
            <Button variant="ghost" onClick={() => setConfirming(true)}>
              Discard…
            </Button>
          ))}
      </div>
    </Card>
  );
}

import { Link, useLocation } from 'react-router-dom';
import { useOutbox } from '@/lib/offline/offline-session';
import { useOnline } from '@/lib/offline/use-online';

/** Above every signed-in screen: no signal, and what is waiting to send (with the way to see it and send it now). */
export function OfflineBanner() {
  const online = useOnline();
  const { outbox, snapshot } = useOutbox();
  const { pathname } = useLocation();
  const refused = snapshot.entries.filter((e) => e.state === 'refused').length;
  const waiting = snapshot.entries.length - refused;
  if ((online || pathname === '/round') && snapshot.entries.length === 0) return null;
  const onWaitingPage = pathname === '/waiting';
  // The round says it itself, with the time its records were saved.
  const sayNoSignal = !online && pathname !== '/round';
  return (
    <div role="status" className="no-print mx-auto mt-2 flex max-w-5xl flex-col gap-1 px-3 sm:px-6" data-offline-banner>
      {sayNoSignal && (
        <p className="rounded-plate bg-iron px-3 py-2 font-semibold text-plate">
          No signal. This phone shows what it saved; what you record is kept here and sent when signal returns.
        </p>
      )}
      {(waiting > 0 || refused > 0) && (
        <p className={`flex flex-wrap items-center gap-x-3 rounded-plate px-3 py-1 font-semibold ${refused ? 'bg-due-soft text-due' : 'bg-soon-soft text-iron'}`}>
          <span>
            {waiting > 0 && `${waiting === 1 ? 'One change' : `${waiting} changes`} waiting to send${snapshot.sending ? ' (sending…)' : ''}.`}
            {refused > 0 && ` ${refused === 1 ? 'One change was' : `${refused} changes were`} not accepted.`}
          </span>
          {!onWaitingPage && (
            <Link to="/waiting" className="inline-flex min-h-tap items-center underline">
              See what is waiting
            </Link>
          )}
          {online && waiting > 0 && !snapshot.sending && outbox && (
            <button type="button" className="min-h-tap underline" onClick={outbox.retryNow}>
              Send now
            </button>
          )}
        </p>
      )}
    </div>
  );
}

import { useParams } from 'react-router-dom';
import { LogoMark } from '@/components/ui/logo-mark';
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/page';
import { useUnsubscribe, useUnsubscribeStatus } from '../api/unsubscribe';
import { RECORD_WORDS } from '@shared/glossary';

/** Opened from a reminder e-mail, without signing in: one button stops the reminder e-mails. */
export function UnsubscribePage() {
  const { token = '' } = useParams();
  const status = useUnsubscribeStatus(token);
  const stop = useUnsubscribe(token);
  return (
    <div className="min-h-screen">
      <header className="bg-header text-header-text">
        <div className="mx-auto flex max-w-2xl items-center gap-2 px-3 py-2">
          <LogoMark />
          <span className="font-bold">Lifeplate</span>
        </div>
      </header>
      <main className="mx-auto flex max-w-2xl flex-col gap-3 px-3 py-6">
        {status.isPending ? (
          <Spinner />
        ) : !status.data ? (
          <>
            <h1 className="text-xl font-bold">This link does not work</h1>
            <p>Check that the whole link was copied from the e-mail, or call your service company.</p>
          </>
        ) : status.data.optedOut ? (
          <>
            <h1 className="text-xl font-bold">Reminder e-mails stopped</h1>
            <p role="status">
              {status.data.companyName} will not send you reminder e-mails any more. To start them again, call {status.data.companyName} at{' '}
              {status.data.companyPhone}.
            </p>
          </>
        ) : (
          <>
            <h1 className="text-xl font-bold">Stop reminder e-mails from {status.data.companyName}?</h1>
            <p>You will no longer get e-mails saying your yearly service or a part is due. Your appliance&apos;s {RECORD_WORDS.lifeRecord} stays as it is.</p>
            <div>
              <Button disabled={stop.isPending} onClick={() => stop.mutate()}>
                {stop.isPending ? 'Stopping…' : 'Stop reminder e-mails'}
              </Button>
            </div>
            {stop.isError && (
              <p role="alert" className="text-due">
                That did not work. Check your connection and try again.
              </p>
            )}
          </>
        )}
      </main>
    </div>
  );
}

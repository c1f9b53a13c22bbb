import { useId, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { useSignOut } from '@/lib/auth';
import { useOutbox } from '@/lib/offline/offline-session';

/** Signing out wipes this phone's saved data; with work still waiting to send, it asks first. */
export function SignOutButton({ className }: { className: string }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  const waiting = useOutbox().snapshot.entries.length;
  const [asking, setAsking] = useState(false);
  const [failed, setFailed] = useState<string | null>(null);
  const titleId = useId();

  async function run() {
    setFailed(null);
    try {
      await signOut.mutateAsync();
      navigate('/sign-in', { replace: true });
    } catch {
      setAsking(false);
      setFailed('Signing out needs signal. Nothing was deleted; try again when signal returns.');
    }
  }

  return (
    <>
      <button type="button" className={className} disabled={signOut.isPending} onClick={() => (waiting > 0 ? setAsking(true) : void run())}>
        Sign out
      </button>
      {failed && (
        <p role="alert" className="fixed inset-x-2 top-16 z-40 mx-auto max-w-md rounded-plate bg-due px-4 py-3 font-semibold text-white">
          {failed}
        </p>
      )}
      {asking && (
        <div className="fixed inset-0 z-40 flex items-end justify-center bg-black/60 sm:items-center" onClick={() => setAsking(false)}>
          <div role="alertdialog" aria-modal="true" aria-labelledby={titleId} className="m-2 flex max-w-md flex-col gap-3 rounded-plate bg-plate p-4 text-iron" onClick={(e) => e.stopPropagation()}>
            <h2 id={titleId} className="text-xl font-bold">
              {waiting === 1 ? 'One change has' : `${waiting} changes have`} not reached the office yet
            </h2>
            <p>Signing out deletes {waiting === 1 ? 'it' : 'them'} from this phone. Stay signed in until there is signal and it has been sent.</p>
            <button type="button" autoFocus className="min-h-tap rounded-plate bg-iron px-4 font-semibold text-plate" onClick={() => setAsking(false)}>
              Stay signed in
            </button>
            <button type="button" className="min-h-tap rounded-plate border-2 border-due px-4 font-semibold text-due" onClick={() => void run()}>
              Sign out and delete {waiting === 1 ? 'it' : 'them'}
            </button>
          </div>
        </div>
      )}
    </>
  );
}

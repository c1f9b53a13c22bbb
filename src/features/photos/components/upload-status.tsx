import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icons';
import type { UploadState } from '../lib/use-photo-upload';

/** One bar for the whole batch, then what happened: saved, already saved, or which files were refused and why. */
export function UploadStatus({ state, onRetry, onStop }: { state: UploadState; onRetry: () => void; onStop: () => void }) {
  if (state.phase === 'idle') return null;
  const text =
    state.phase === 'sending'
      ? state.percent < 100
        ? `Sending ${state.count} photo${state.count === 1 ? '' : 's'}… ${state.percent}%`
        : 'Sent. Saving on the server…'
      : state.phase === 'saved'
        ? state.summary
        : null;
  return (
    <div className="flex flex-col gap-2" data-upload-phase={state.phase}>
      {(state.phase === 'sending' || state.phase === 'saved') && (
        <>
          <div
            role="progressbar"
            aria-label="Upload progress"
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={state.percent}
            className="h-3 w-full overflow-hidden rounded-full border border-plate-line bg-surface"
          >
            <div className={`h-full ${state.phase === 'saved' ? 'bg-ok' : 'bg-brass'}`} style={{ width: `${state.percent}%` }} />
          </div>
          <p role="status" className="flex items-center gap-1.5 text-sm font-semibold">
            {state.phase === 'saved' && <Icon name="check" className="h-4 w-4 text-ok" />}
            {text}
          </p>
        </>
      )}
      {/* Stopping after the bytes are sent is safe too: sending again finds the stored file and says "Already saved". */}
      {state.phase === 'sending' && (
        <Button variant="secondary" className="w-full" onClick={onStop}>
          Stop sending
        </Button>
      )}
      {state.phase === 'failed' && (
        <div role="alert" className="rounded-plate border-l-4 border-due bg-due-soft p-3 text-sm">
          <p className="flex items-start gap-1.5 font-bold text-due">
            <Icon name="alert" className="mt-0.5 h-4 w-4" />
            Not saved
          </p>
          <p>{state.error}</p>
        </div>
      )}
      {state.rejected.length > 0 && (
        <ul aria-label="Files not taken" className="flex flex-col gap-1 text-sm">
          {state.rejected.map((r) => (
            <li key={r.name} className="rounded-plate border border-due bg-surface p-2">
              <span className="font-semibold break-all">{r.name}</span>: {r.message}
            </li>
          ))}
        </ul>
      )}
      {state.phase === 'failed' && state.retry && (
        <Button variant="primary" className="w-full" onClick={onRetry}>
          {state.retry.label}
        </Button>
      )}
    </div>
  );
}

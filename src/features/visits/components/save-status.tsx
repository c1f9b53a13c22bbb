import type { SyncStatus } from '../draft/draft-sync';

const TEXT: Record<SyncStatus, { icon: string; text: string; cls: string }> = {
  saved: { icon: '✓', text: 'Saved', cls: 'bg-iron text-plate' },
  pending: { icon: '…', text: 'Saving…', cls: 'bg-iron text-plate' },
  saving: { icon: '↑', text: 'Saving…', cls: 'bg-iron text-plate' },
  queued: { icon: '▣', text: 'Saved on this phone — will send when signal returns', cls: 'bg-soon text-black' },
  invalid: { icon: '!', text: 'Saved on this phone — not sent: check the fields marked below', cls: 'bg-due text-white' },
  conflict: { icon: '!', text: 'Saved on this phone — not sent', cls: 'bg-due text-white' },
  error: { icon: '!', text: 'Saved on this phone — not sent', cls: 'bg-due text-white' },
  completed: { icon: '✓', text: 'Visit completed', cls: 'bg-ok text-white' },
  'finished-offline': { icon: '▣', text: 'Finished on this phone — will send when signal returns', cls: 'bg-soon text-black' },
};

/** Always visible at the bottom of the screen, where the thumb is. */
export function SaveStatus({ status, message, onRetry }: { status: SyncStatus; message: string | null; onRetry: () => void }) {
  const look = TEXT[status];
  return (
    <div className={`no-print sticky bottom-0 z-10 -mx-3 flex min-h-tap items-center gap-2 px-3 py-2 font-semibold sm:mx-0 sm:rounded-plate ${look.cls}`}>
      <p role="status" aria-live="polite" className="flex-1" data-save-status={status}>
        <span aria-hidden="true">{look.icon} </span>
        {look.text}
        {message && status !== 'saved' && <span className="block text-sm font-normal">{message}</span>}
      </p>
      {(status === 'conflict' || status === 'error' || status === 'queued') && (
        <button type="button" onClick={onRetry} className="min-h-tap rounded-plate border-2 border-current px-3">
          Try now
        </button>
      )}
    </div>
  );
}

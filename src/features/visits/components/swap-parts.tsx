import { useEffect, useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import type { ComponentDto } from '@shared/schemas/records';
import type { VisitDto } from '@shared/schemas/visits';
import { quickReasonsFor } from '@shared/glossary';
import { SWAP_CAUSE_LABELS, SWAP_CAUSES, type SwapCause } from '@shared/stats/swap-causes';
import { useSwapPart } from '../api/swap-part';
import { queuedOf } from '../api/visit-outbox';
import { useOutbox } from '@/lib/offline/offline-session';
import { Panel, TextInput } from './inputs';


export function SwapParts({ visit, components, onSwapped }: { visit: VisitDto; components: ComponentDto[] | undefined; onSwapped: (v: VisitDto) => void }) {
  const [picked, setPicked] = useState<ComponentDto | null>(null);
  const waiting = queuedOf(useOutbox().snapshot.entries, visit.id, 'part-swap');
  const waitingIds = new Set(waiting.map((e) => (e.request.body as { componentId?: string }).componentId));
  // A part already swapped on this phone (waiting to send) is not offered again.
  const current = (components ?? []).filter((c) => !c.removedOn && !waitingIds.has(c.id));
  return (
    <Panel title="Swap a part">
      {visit.swaps.length > 0 && (
        <ul aria-label="Swapped on this visit" className="flex flex-col gap-1">
          {visit.swaps.map((s) => (
            <li key={s.id} className="rounded-plate bg-ok-soft px-3 py-2 font-semibold text-ok">
              ✓ {s.typeLabel} replaced{s.reason ? ` · ${s.reason}` : ''}
              {s.newDescription ? ` · new: ${s.newDescription}` : ''}
            </li>
          ))}
        </ul>
      )}
      {waiting.length > 0 && (
        <ul aria-label="Swapped on this phone, waiting to send" className="flex flex-col gap-1">
          {waiting.map((e) => (
            <li key={e.seq} className="rounded-plate bg-soon-soft px-3 py-2 font-semibold">
              ▣ {e.label} · {e.state === 'refused' ? `not accepted: ${e.refusal?.message ?? ''}` : 'waiting for signal'}
            </li>
          ))}
        </ul>
      )}
      {components === undefined ? (
        <p role="status">Loading the parts…</p>
      ) : current.length === 0 ? (
        <p>No parts recorded on this appliance.</p>
      ) : (
        <ul className="flex flex-col gap-1">
          {current.map((c) => (
            <li key={c.id}>
              <button
                type="button"
                onClick={() => setPicked(c)}
                className="flex min-h-tap w-full items-center justify-between gap-2 rounded-plate border-2 border-plate-line bg-plate px-3 py-2 text-left"
              >
                <span>
                  <span className="font-semibold">{c.typeLabel}</span>
                  {c.specKey && <span className="text-iron-muted"> · {c.specKey}</span>}
                </span>
                <span aria-hidden="true" className="text-xl">⇄</span>
              </button>
            </li>
          ))}
        </ul>
      )}
      {picked && (
        <SwapSheet
          visitId={visit.id}
          component={picked}
          onClose={() => setPicked(null)}
          onDone={(v) => {
            if (v) onSwapped(v);
            setPicked(null);
          }}
        />
      )}
    </Panel>
  );
}

function SwapSheet({ visitId, component, onClose, onDone }: { visitId: string; component: ComponentDto; onClose: () => void; onDone: (v: VisitDto | null) => void }) {
  const titleId = useId();
  const swap = useSwapPart();
  const [reason, setReason] = useState('');
  // Asked every time, never preset: only a part that wore out or failed counts as the end of its service life.
  const [cause, setCause] = useState<SwapCause | null>(null);
  const [causeMissing, setCauseMissing] = useState(false);
  const causeId = useId();
  const [newDescription, setNewDescription] = useState(component.description ?? '');
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => e.key === 'Escape' && onClose();
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [onClose]);
  const details = swap.error instanceof ApiError ? swap.error.details : undefined;

  return (
    <div className="fixed inset-0 z-30 flex flex-col justify-end bg-black/60" onClick={onClose}>
      <div
        role="dialog"
        aria-modal="true"
        aria-labelledby={titleId}
        className="flex max-h-[90vh] flex-col gap-3 overflow-y-auto rounded-t-plate border-t-4 border-brass bg-plate p-4 text-iron"
        onClick={(e) => e.stopPropagation()}
      >
        <h2 id={titleId} className="text-xl font-bold">
          Replace the {component.typeLabel}
          {component.specKey ? ` (${component.specKey})` : ''}
        </h2>
        {swap.isError && (
          <Notice kind="danger" title="Not recorded">
            {swap.error instanceof ApiError && swap.error.offline ? 'No signal. Try again when you have signal; nothing was recorded yet.' : swap.error.message}
          </Notice>
        )}
        <fieldset className="flex flex-col gap-1" aria-describedby={causeMissing || details?.cause ? causeId : undefined}>
          <legend className="text-sm font-semibold">Why did the old part come out?</legend>
          {SWAP_CAUSES.map((c) => (
            <label key={c} className="flex min-h-tap items-center gap-2 rounded-plate border-2 border-plate-line bg-plate-deep px-3">
              <input
                type="radio"
                name="swap-cause"
                value={c}
                checked={cause === c}
                onChange={() => {
                  setCause(c);
                  setCauseMissing(false);
                }}
              />
              {SWAP_CAUSE_LABELS[c]}
            </label>
          ))}
          {(causeMissing || details?.cause) && (
            <p id={causeId} className="text-sm font-semibold text-due">
              {details?.cause?.[0] ?? 'Say why the old part came out.'}
            </p>
          )}
        </fieldset>
        <div className="flex flex-col gap-1">
          <span className="text-sm font-semibold">What was wrong (optional)</span>
          <div className="flex flex-wrap gap-1" role="group" aria-label="Quick reasons">
            {quickReasonsFor(component.typeCode).map((r) => (
              <button
                key={r}
                type="button"
                aria-pressed={reason === r}
                onClick={() => setReason(reason === r ? '' : r)}
                className={`min-h-tap rounded-full border-2 px-3 ${reason === r ? 'border-iron bg-iron text-plate' : 'border-plate-line bg-plate-deep'}`}
              >
                {r}
              </button>
            ))}
          </div>
          <TextInput label="Reason" value={reason} onChange={setReason} maxLength={500} error={details?.reason} />
        </div>
        <TextInput label="New part (optional)" placeholder="e.g. thermocouple, 24 in" value={newDescription} onChange={setNewDescription} maxLength={200} error={details?.newDescription} />
        <Button
          className="min-h-14 text-xl"
          disabled={swap.isPending}
          onClick={() => {
            if (!cause) {
              setCauseMissing(true);
              return;
            }
            swap.mutate(
              {
                visitId,
                label: `${component.typeLabel} replaced${reason.trim() ? ` · ${reason.trim()}` : ''}`,
                componentId: component.id,
                cause,
                reason: reason.trim() || null,
                newDescription: newDescription.trim() || null,
              },
              { onSuccess: onDone },
            );
          }}
        >
          {swap.isPending ? 'Recording…' : 'Replaced today'}
        </Button>
        <Button variant="ghost" onClick={onClose}>
          Cancel
        </Button>
      </div>
    </div>
  );
}

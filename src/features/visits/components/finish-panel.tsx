import type { ReactNode } from 'react';
import type { Requirement } from '@shared/visits/completion-requirements';
import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icons';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { Panel } from './inputs';

/**
 * The "Complete visit" button with what still stands in its way, by the rule the server applies. Each entry jumps to
 * its field; unmarked steps are one entry (with the full list folded under it), so a phone screen is not all list.
 */
export function FinishPanel({
  requirements,
  tried,
  completing,
  completeError,
  onComplete,
  onJump,
}: {
  requirements: Requirement[];
  tried: boolean;
  completing: boolean;
  completeError: ApiError | Error | null;
  onComplete: () => void;
  onJump: (field: string) => void;
}) {
  const steps = requirements.filter((r) => r.field.startsWith('checklist.'));
  const others = requirements.filter((r) => !r.field.startsWith('checklist.'));
  const count = requirements.length;
  const showError = completeError && !(completeError instanceof ApiError && completeError.status === 400);
  return (
    <Panel title="Finish" id="finish">
      {showError && (
        <Notice kind="danger" title="Not completed">
          {completeError instanceof ApiError && completeError.offline
            ? 'No signal: a visit can only be completed with signal. Everything is saved on this phone; try again when signal returns.'
            : completeError.message}
        </Notice>
      )}
      {count === 0 ? (
        <p className="flex items-center gap-1.5 font-semibold text-ok">
          <Icon name="check" className="h-5 w-5" /> Everything a completed visit needs is recorded.
        </p>
      ) : (
        <div
          id="complete-missing"
          role="region"
          aria-label="Still needed before completing"
          className={`flex flex-col gap-2 rounded-plate border-2 p-3 ${tried ? 'border-due bg-due-soft' : 'border-plate-line bg-plate'}`}
        >
          {tried && (
            <p role="alert" className="font-bold text-due">
              Not completed yet: fix what is listed here first.
            </p>
          )}
          <p className="font-bold">{count === 1 ? 'One thing is' : `${count} things are`} still needed:</p>
          <ul className="flex flex-col text-sm">
            {steps.length > 0 && (
              <li data-missing="checklist">
                <JumpButton onClick={() => onJump(steps[0].field)}>
                  {steps.length === 1 ? `Checklist: “${steps[0].label}” not marked` : `Checklist: ${steps.length} steps not marked`}
                </JumpButton>
                {steps.length > 1 && (
                  <details className="pl-2">
                    <summary className="min-h-tap cursor-pointer py-2 font-semibold">Which steps</summary>
                    <ul>
                      {steps.map((s) => (
                        <li key={s.field}>
                          <JumpButton onClick={() => onJump(s.field)}>{s.label}</JumpButton>
                        </li>
                      ))}
                    </ul>
                  </details>
                )}
              </li>
            )}
            {others.map((r) => (
              <li key={`${r.field}:${r.message}`} data-missing={r.field}>
                <JumpButton onClick={() => onJump(r.field)}>
                  <strong>{r.label}:</strong> {r.message}
                </JumpButton>
              </li>
            ))}
          </ul>
        </div>
      )}
      <Button className="min-h-14 text-xl" disabled={completing} aria-describedby={count ? 'complete-missing' : undefined} onClick={onComplete}>
        {completing ? 'Completing…' : 'Complete visit'}
      </Button>
    </Panel>
  );
}

function JumpButton({ onClick, children }: { onClick: () => void; children: ReactNode }) {
  return (
    <button type="button" onClick={onClick} className="flex min-h-tap w-full items-center gap-1 py-1 text-left underline decoration-1 underline-offset-2">
      <span aria-hidden="true">→</span>
      <span>{children}</span>
    </button>
  );
}

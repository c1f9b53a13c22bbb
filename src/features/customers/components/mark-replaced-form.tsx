import { useState, type FormEvent } from 'react';
import { replaceApplianceInput, type ApplianceSummary } from '@shared/schemas/records';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import type { FieldErrors } from '@/lib/api-client';
import { useReplaceAppliance } from '../api/replace-appliance';
import { applianceLabel } from './appliance-labels';
import { describeFailure, unclaimedErrors, zodFieldErrors } from '@/lib/form-errors';
import { useFocusFirstError } from '@/lib/use-focus-first-error';

const todayIso = () => {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
};

/** Marks an appliance removed and links the one that replaced it; the old life record stays readable. */
export function MarkReplacedForm({ appliance, candidates, onDone }: { appliance: ApplianceSummary; candidates: ApplianceSummary[]; onDone: () => void }) {
  const replace = useReplaceAppliance();
  const [draft, setDraft] = useState({ newApplianceId: '', removedOn: todayIso(), reason: '' });
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const formRef = useFocusFirstError<HTMLFormElement>(errors);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setFailure(null);
    const parsed = replaceApplianceInput.safeParse(draft);
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    try {
      await replace.mutateAsync({ id: appliance.id, body: parsed.data });
      onDone();
    } catch (err) {
      const { fields, message } = describeFailure(err);
      setErrors(fields);
      setFailure(message);
    }
  }

  const other = unclaimedErrors(errors, (k) => ['newApplianceId', 'removedOn', 'reason'].includes(k));
  return (
    <form ref={formRef} onSubmit={submit} noValidate aria-label="Mark replaced" className="mt-2 flex flex-col gap-3 rounded-plate border-2 border-plate-line bg-plate p-3">
      <p className="text-sm">
        The old appliance is marked removed; its life record, visits and parts stay readable and link to the new one.
      </p>
      {(failure || other.length > 0) && (
        <Notice kind="danger" title="Not marked replaced">
          {failure && <p>{failure}</p>}
          {other.map((m) => (
            <p key={m}>{m}</p>
          ))}
        </Notice>
      )}
      {candidates.length === 0 ? (
        <Notice kind="caution" title="Add the new appliance first">
          Add the appliance that replaced this one (at any of this customer's sites), then come back to link them.
        </Notice>
      ) : (
        <>
          <SelectField
            label="Replaced by"
            value={draft.newApplianceId}
            onChange={(e) => setDraft({ ...draft, newApplianceId: e.target.value })}
            error={errors.newApplianceId}
          >
            <option value="">Choose the new appliance…</option>
            {candidates.map((c) => (
              <option key={c.id} value={c.id}>
                {applianceLabel(c)}
                {c.serial ? ` · serial ${c.serial}` : ''}
                {c.location ? ` · ${c.location}` : ''}
              </option>
            ))}
          </SelectField>
          <div className="grid gap-3 sm:grid-cols-2">
            <TextField label="Removed on" type="date" value={draft.removedOn} onChange={(e) => setDraft({ ...draft, removedOn: e.target.value })} error={errors.removedOn} />
            <TextField
              label="Reason (optional)"
              placeholder="e.g. cracked section"
              value={draft.reason}
              onChange={(e) => setDraft({ ...draft, reason: e.target.value })}
              error={errors.reason}
            />
          </div>
        </>
      )}
      <div className="flex flex-wrap gap-2">
        {candidates.length > 0 && (
          <Button type="submit" disabled={replace.isPending}>
            {replace.isPending ? 'Saving…' : 'Mark replaced'}
          </Button>
        )}
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { useMarkNoAccess } from '../api/mark-no-access';

const REASONS = ['Nobody home', 'Could not reach the boiler room', 'The customer asked to come another day'] as const;
const OTHER = 'other';

/** "No access": the reason goes to the office, which rebooks. */
export function NoAccessForm({ bookingId }: { bookingId: string }) {
  const [open, setOpen] = useState(false);
  const [choice, setChoice] = useState<string>(REASONS[0]);
  const [other, setOther] = useState('');
  const mark = useMarkNoAccess();
  if (!open) {
    return (
      <Button variant="secondary" onClick={() => setOpen(true)}>
        No access
      </Button>
    );
  }
  const details = mark.error instanceof ApiError ? mark.error.details : undefined;
  const submit = (e: FormEvent) => {
    e.preventDefault();
    mark.mutate({ bookingId, reason: choice === OTHER ? other : choice });
  };
  return (
    <form onSubmit={submit} className="flex flex-col gap-2" aria-label="No access">
      <SelectField label="Why no access?" value={choice} onChange={(e) => setChoice(e.target.value)}>
        {REASONS.map((r) => (
          <option key={r}>{r}</option>
        ))}
        <option value={OTHER}>Something else…</option>
      </SelectField>
      {choice === OTHER && <TextField label="What happened" value={other} onChange={(e) => setOther(e.target.value)} error={details?.reason} maxLength={500} />}
      {mark.isError && !details && (
        <Notice kind="danger" title="Not saved">
          {mark.error.message}
        </Notice>
      )}
      <div className="flex gap-2">
        <Button type="submit" disabled={mark.isPending}>
          {mark.isPending ? 'Saving…' : 'Tell the office'}
        </Button>
        <Button variant="secondary" onClick={() => setOpen(false)}>
          Back
        </Button>
      </div>
    </form>
  );
}

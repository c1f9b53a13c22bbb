import { useState, type FormEvent } from 'react';
import { customerInput, type CustomerDto } from '@shared/schemas/records';
import { CUSTOMER_KINDS, LABELS, type CustomerKind } from '@shared/schemas/enums';
import { FormActions } from '@/components/ui/form-actions';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import type { CustomerBody } from '../api/create-customer';
import { CheckboxField } from './checkbox-field';
import { unclaimedErrors } from '@/lib/form-errors';
import { useValidatedSubmit } from '@/lib/use-validated-submit';

type Draft = { name: string; kind: CustomerKind; phone: string; email: string; remindersOptOut: boolean; notes: string };
const FIELDS = ['name', 'kind', 'phone', 'email', 'remindersOptOut', 'notes'];

const toDraft = (c?: CustomerDto): Draft => ({
  name: c?.name ?? '',
  kind: c?.kind ?? 'homeowner',
  phone: c?.phone ?? '',
  email: c?.email ?? '',
  remindersOptOut: c?.remindersOptOut ?? false,
  notes: c?.notes ?? '',
});

/** New and edit share one form. The draft lives here and is never reset on an error, so nothing typed is lost. */
export function CustomerForm({
  initial,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  initial?: CustomerDto;
  submitLabel: string;
  onSubmit: (body: CustomerBody) => Promise<unknown>;
  onCancel?: () => void;
}) {
  const [draft, setDraft] = useState<Draft>(() => toDraft(initial));
  const { errors, failure, saving, formRef, submit: validateAndSend } = useValidatedSubmit(customerInput, onSubmit);
  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => setDraft((d) => ({ ...d, [key]: value }));

  function submit(e: FormEvent) {
    e.preventDefault();
    void validateAndSend(draft);
  }

  const other = unclaimedErrors(errors, (k) => FIELDS.includes(k));
  return (
    <form ref={formRef} onSubmit={submit} noValidate className="flex max-w-xl flex-col gap-4">
      {(failure || other.length > 0) && (
        <Notice kind="danger" title="Not saved">
          {failure && <p>{failure}</p>}
          {other.map((m) => (
            <p key={m}>{m}</p>
          ))}
        </Notice>
      )}
      <TextField label="Name" autoComplete="off" value={draft.name} onChange={(e) => set('name', e.target.value)} error={errors.name} />
      <SelectField label="Kind of customer" value={draft.kind} onChange={(e) => set('kind', e.target.value as CustomerKind)} error={errors.kind}>
        {CUSTOMER_KINDS.map((k) => (
          <option key={k} value={k}>
            {LABELS.customerKind[k]}
          </option>
        ))}
      </SelectField>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Phone" type="tel" autoComplete="off" value={draft.phone} onChange={(e) => set('phone', e.target.value)} error={errors.phone} />
        <TextField label="E-mail" type="email" autoComplete="off" value={draft.email} onChange={(e) => set('email', e.target.value)} error={errors.email} />
      </div>
      <CheckboxField
        label="No reminder e-mails"
        hint="Tick when the customer asked not to be reminded when service is due."
        checked={draft.remindersOptOut}
        onChange={(e) => set('remindersOptOut', e.target.checked)}
        error={errors.remindersOptOut}
      />
      <TextAreaField label="Notes" value={draft.notes} onChange={(e) => set('notes', e.target.value)} error={errors.notes} />
      <FormActions saving={saving} submitLabel={submitLabel} onCancel={onCancel} />
    </form>
  );
}

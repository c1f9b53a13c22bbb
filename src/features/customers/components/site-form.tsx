import { useState, type FormEvent } from 'react';
import { siteInput, type SiteDto } from '@shared/schemas/records';
import { FormActions } from '@/components/ui/form-actions';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import type { SiteBody } from '../api/create-site';
import { useTechnicians } from '@/lib/resources/members';
import { unclaimedErrors } from '@/lib/form-errors';
import { useValidatedSubmit } from '@/lib/use-validated-submit';

type Draft = { street: string; town: string; postalCode: string; accessNotes: string; elevationFt: string; assignedTechnicianId: string };
const FIELDS = ['customerId', 'street', 'town', 'postalCode', 'accessNotes', 'elevationFt', 'assignedTechnicianId'];

/** Add or edit a site (a service address). The draft survives any error. */
export function SiteForm({
  customerId,
  initial,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  customerId: string;
  initial?: SiteDto;
  submitLabel: string;
  onSubmit: (body: SiteBody) => Promise<unknown>;
  onCancel?: () => void;
}) {
  const technicians = useTechnicians();
  const [draft, setDraft] = useState<Draft>({
    street: initial?.street ?? '',
    town: initial?.town ?? '',
    postalCode: initial?.postalCode ?? '',
    accessNotes: initial?.accessNotes ?? '',
    elevationFt: initial?.elevationFt?.toString() ?? '',
    assignedTechnicianId: initial?.assignedTechnicianId ?? '',
  });
  const { errors, failure, saving, formRef, submit: validateAndSend } = useValidatedSubmit(siteInput, onSubmit);
  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => setDraft((d) => ({ ...d, [key]: value }));

  function submit(e: FormEvent) {
    e.preventDefault();
    void validateAndSend({ ...draft, customerId, elevationFt: draft.elevationFt.trim() === '' ? null : draft.elevationFt.trim(), assignedTechnicianId: draft.assignedTechnicianId || null });
  }

  const other = unclaimedErrors(errors, (k) => FIELDS.includes(k));
  // A technician who has left still shows on an old site until someone picks another.
  const assignedGone = draft.assignedTechnicianId && !technicians.data?.some((t) => t.userId === draft.assignedTechnicianId);
  return (
    <form ref={formRef} onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label={submitLabel}>
      {(failure || other.length > 0) && (
        <Notice kind="danger" title="Site not saved">
          {failure && <p>{failure}</p>}
          {other.map((m) => (
            <p key={m}>{m}</p>
          ))}
        </Notice>
      )}
      <TextField label="Street address" autoComplete="off" value={draft.street} onChange={(e) => set('street', e.target.value)} error={errors.street} />
      <div className="grid gap-4 sm:grid-cols-[2fr_1fr]">
        <TextField label="Town" autoComplete="off" value={draft.town} onChange={(e) => set('town', e.target.value)} error={errors.town} />
        <TextField label="Postal code" autoComplete="off" value={draft.postalCode} onChange={(e) => set('postalCode', e.target.value)} error={errors.postalCode} />
      </div>
      <TextAreaField
        label="Access notes"
        hint='What the technician needs at the door, e.g. "side door, dog in yard, key with neighbour".'
        value={draft.accessNotes}
        onChange={(e) => set('accessNotes', e.target.value)}
        error={errors.accessNotes}
      />
      <TextField
        label="Elevation (ft above sea level)"
        inputMode="numeric"
        autoComplete="off"
        value={draft.elevationFt}
        onChange={(e) => set('elevationFt', e.target.value)}
        error={errors.elevationFt}
        hint="Above 2,000 ft a gas appliance's nameplate input is derated for altitude (NFPA 54) before a clocked input is judged. Leave blank if not known."
      />
      <SelectField
        label="Assigned technician"
        value={draft.assignedTechnicianId}
        onChange={(e) => set('assignedTechnicianId', e.target.value)}
        error={errors.assignedTechnicianId}
        hint={technicians.isError ? 'Could not load the technicians; the site can be saved without one.' : undefined}
      >
        <option value="">Nobody in particular</option>
        {assignedGone && <option value={draft.assignedTechnicianId}>{initial?.assignedTechnicianName ?? 'Former technician'}</option>}
        {technicians.data?.map((t) => (
          <option key={t.userId} value={t.userId}>
            {t.name}
          </option>
        ))}
      </SelectField>
      <FormActions saving={saving} submitLabel={submitLabel} onCancel={onCancel} />
    </form>
  );
}

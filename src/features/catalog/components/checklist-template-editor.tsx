import { useState, type FormEvent } from 'react';
import { checklistTemplateInput, type ChecklistTemplateDto } from '@shared/schemas/records';
import { Button } from '@/components/ui/button';
import { FormActions } from '@/components/ui/form-actions';
import { TextAreaField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import type { FieldErrors } from '@/lib/api-client';
import { useSaveChecklistTemplate } from '../api/save-checklist-template';
import { newItemDraft, toTemplateBody, toTemplateDraft, type ItemDraft, type TemplateDraft } from './checklist-draft';
import { describeFailure, unclaimedErrors, zodFieldErrors } from '@/lib/form-errors';
import { useFocusFirstError } from '@/lib/use-focus-first-error';
import { LABELS, type VisitType } from '@shared/schemas/enums';
import { READING_LABELS } from '@shared/visits/reading-labels';

export function ChecklistTemplateEditor({ template, onClose }: { template: ChecklistTemplateDto; onClose: () => void }) {
  const save = useSaveChecklistTemplate();
  const [draft, setDraft] = useState<TemplateDraft>(() => toTemplateDraft(template));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const formRef = useFocusFirstError<HTMLFormElement>(errors);

  const setItems = (update: (items: ItemDraft[]) => ItemDraft[], reordered = false) => {
    setDraft((d) => ({ ...d, items: update(d.items) }));
    // Errors are keyed by position; after a move or removal they would sit on the wrong item.
    if (reordered) setErrors((e) => Object.fromEntries(Object.entries(e).filter(([k]) => !k.startsWith('items'))));
  };
  const patchItem = (rowId: number, patch: Partial<ItemDraft>) => setItems((items) => items.map((i) => (i.rowId === rowId ? { ...i, ...patch } : i)));
  const move = (index: number, by: -1 | 1) =>
    setItems((items) => {
      const next = [...items];
      const [item] = next.splice(index, 1);
      next.splice(index + by, 0, item);
      return next;
    }, true);

  async function submit(e: FormEvent) {
    e.preventDefault();
    setFailure(null);
    const parsed = checklistTemplateInput.safeParse(toTemplateBody(draft));
    if (!parsed.success) {
      setErrors(zodFieldErrors(parsed.error));
      setFailure('Some items need a look; they are marked below. Nothing you typed is lost.');
      return;
    }
    setErrors({});
    try {
      await save.mutateAsync({ id: template.id, body: parsed.data });
      onClose();
    } catch (err) {
      const { fields, message } = describeFailure(err);
      setErrors(fields);
      setFailure(message);
    }
  }

  const other = unclaimedErrors(errors, (k) => k === 'name' || /^items\.\d+\.(section|label|caution)$/.test(k));
  const lastSection = draft.items.at(-1)?.section ?? '';
  return (
    <form ref={formRef} onSubmit={submit} noValidate aria-label={`Edit checklist ${template.name}`} className="flex flex-col gap-4">
      {(failure || other.length > 0) && (
        <Notice kind="danger" title="Checklist not saved">
          {failure && <p>{failure}</p>}
          {other.map((m) => (
            <p key={m}>{m}</p>
          ))}
        </Notice>
      )}
      <TextField label="Checklist name" value={draft.name} onChange={(e) => setDraft({ ...draft, name: e.target.value })} error={errors.name} />
      <RequiredReadingsNote requiredReadings={template.requiredReadings} />
      <Notice kind="caution" title="Cautions reach the technician">
        Where an item can hurt someone (gas, carbon monoxide, steam pressure, low water, hot surfaces), write the caution
        in one sentence and defer to the manufacturer&rsquo;s instructions, local codes and licensed practice.
      </Notice>
      <ol className="flex flex-col gap-3">
        {draft.items.map((item, i) => {
          const itemErrors = (f: string) => errors[`items.${i}.${f}`];
          const hasErrors = Object.keys(errors).some((k) => k.startsWith(`items.${i}.`));
          return (
            <li
              key={item.rowId}
              aria-label={`Item ${i + 1}`}
              data-item-key={item.key || undefined}
              className={`rounded-plate border-2 p-3 ${hasErrors ? 'border-due bg-due-soft/30' : 'border-plate-line bg-plate'}`}
            >
              <div className="mb-2 flex flex-wrap items-center gap-2">
                <span className="font-semibold">
                  {hasErrors && <span aria-hidden="true">⚠ </span>}Item {i + 1}
                </span>
                {!item.key && <span className="text-xs text-iron-muted">new item</span>}
                {item.readings?.length ? <span className="text-xs text-iron-muted">· asks for readings: {item.readings.map(readingLabel).join(', ')}</span> : null}
                <div className="ml-auto flex gap-1">
                  <Button variant="ghost" disabled={i === 0} onClick={() => move(i, -1)} aria-label={`Move item ${i + 1} up`}>
                    ↑
                  </Button>
                  <Button variant="ghost" disabled={i === draft.items.length - 1} onClick={() => move(i, 1)} aria-label={`Move item ${i + 1} down`}>
                    ↓
                  </Button>
                  <Button
                    variant="ghost"
                    onClick={() => setItems((items) => items.filter((x) => x.rowId !== item.rowId), true)}
                    aria-label={`Remove item ${i + 1}`}
                  >
                    ✕ Remove
                  </Button>
                </div>
              </div>
              <div className="grid gap-3 md:grid-cols-[1fr_2fr]">
                <TextField label="Section" value={item.section} onChange={(e) => patchItem(item.rowId, { section: e.target.value })} error={itemErrors('section')} />
                <TextAreaField
                  label="Item"
                  rows={2}
                  value={item.label}
                  onChange={(e) => patchItem(item.rowId, { label: e.target.value })}
                  error={itemErrors('label')}
                  hint={item.label.length > 160 ? `${item.label.length} of 200 characters` : undefined}
                />
              </div>
              <div className="mt-3">
                <TextAreaField
                  label="Caution (optional)"
                  rows={2}
                  value={item.caution}
                  onChange={(e) => patchItem(item.rowId, { caution: e.target.value })}
                  error={itemErrors('caution')}
                />
              </div>
            </li>
          );
        })}
      </ol>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={() => setItems((items) => [...items, newItemDraft(lastSection)])}>
          + Add item
        </Button>
      </div>
      <FormActions saving={save.isPending} submitLabel="Save checklist" onCancel={onClose} />
    </form>
  );
}

/** A reading's name; an unknown key (from an older template) made readable, never shown as a code. */
const readingLabel = (key: string) => (Object.hasOwn(READING_LABELS, key) ? READING_LABELS[key as keyof typeof READING_LABELS] : key.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase());

/** Which readings a visit from this template must record (or skip with a reason) before it can be completed. */
function RequiredReadingsNote({ requiredReadings }: { requiredReadings: ChecklistTemplateDto['requiredReadings'] }) {
  const entries = Object.entries(requiredReadings ?? {}).filter(([, keys]) => keys?.length);
  if (!entries.length) return null;
  return (
    <Notice kind="info" title="Required before a visit is completed">
      {entries.map(([type, keys]) => (
        <p key={type}>
          {LABELS.visitType[type as VisitType]}: {keys!.map((k) => READING_LABELS[k]).join(', ')}. The technician records each or says why it was not taken.
        </p>
      ))}
    </Notice>
  );
}

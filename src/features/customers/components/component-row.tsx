import type { CatalogEntryDto } from '@shared/schemas/records';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import type { FieldErrors } from '@/lib/api-client';
import type { ComponentDraft } from './appliance-draft';
import { formSpecFields, groupedEntries, unitText } from './catalog-spec-fields';
import { CheckboxField } from './checkbox-field';
import { unclaimedErrors } from '@/lib/form-errors';
import { partName } from '@shared/glossary';

const ROW_FIELDS = ['typeCode', 'installedOn', 'originalWithAppliance', 'note'];

export function ComponentRow({
  index,
  row,
  catalog,
  errors,
  onChange,
  onRemove,
}: {
  index: number;
  row: ComponentDraft;
  catalog: CatalogEntryDto[];
  errors: FieldErrors;
  onChange: (patch: Partial<ComponentDraft>) => void;
  onRemove: () => void;
}) {
  const entry = catalog.find((c) => c.code === row.typeCode);
  const specFields = formSpecFields(entry);
  const other = unclaimedErrors(errors, (k) => ROW_FIELDS.includes(k) || specFields.some((f) => `spec.${f.key}` === k));
  const title = `Part ${index + 1}${entry ? `: ${entry.label}` : ''}`;
  const hasErrors = Object.keys(errors).length > 0;

  return (
    <li
      aria-label={title}
      className={`rounded-plate border-2 p-3 ${hasErrors ? 'border-due bg-due-soft/30' : 'border-plate-line bg-plate'}`}
    >
      <div className="mb-2 flex items-center justify-between gap-2">
        <h3 className="font-semibold">
          {hasErrors && <span aria-hidden="true">⚠ </span>}
          {title}
        </h3>
        <Button variant="ghost" onClick={onRemove} aria-label={`Remove part ${index + 1}${entry ? ` (${entry.label})` : ''}`}>
          ✕ Remove
        </Button>
      </div>
      {other.map((m) => (
        <p key={m} role="alert" className="mb-2 text-sm font-semibold text-due">
          ⚠ {m}
        </p>
      ))}
      <div className="grid gap-3 md:grid-cols-3">
        <SelectField
          label="Part type"
          value={row.typeCode}
          onChange={(e) => onChange({ typeCode: e.target.value, spec: {} })}
          error={errors.typeCode}
        >
          <option value="">Choose the part…</option>
          {row.typeCode && !entry && <option value={row.typeCode}>{partName(row.typeCode)} (not among your part types)</option>}
          {groupedEntries(catalog).map((g) => (
            <optgroup key={g.group} label={g.label}>
              {g.entries.map((e) => (
                <option key={e.code} value={e.code}>
                  {e.label}
                </option>
              ))}
            </optgroup>
          ))}
        </SelectField>
        {specFields.map((f) =>
          f.kind === 'choice' ? (
            <SelectField
              key={f.key}
              label={capitalise(f.label)}
              value={row.spec[f.key] ?? ''}
              onChange={(e) => onChange({ spec: { ...row.spec, [f.key]: e.target.value } })}
              error={errors[`spec.${f.key}`]}
            >
              <option value="">Not known</option>
              {f.options.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </SelectField>
          ) : (
            <TextField
              key={f.key}
              label={f.kind === 'number' && f.unit ? `${capitalise(f.label)} (${unitText(f.unit)})` : capitalise(f.label)}
              inputMode={f.kind === 'number' ? 'decimal' : undefined}
              value={row.spec[f.key] ?? ''}
              onChange={(e) => onChange({ spec: { ...row.spec, [f.key]: e.target.value } })}
              error={errors[`spec.${f.key}`]}
            />
          ),
        )}
      </div>
      <div className="mt-3 grid gap-3 md:grid-cols-3">
        <div className="flex flex-col justify-end">
          <CheckboxField
            label="Original with the appliance"
            checked={row.originalWithAppliance}
            onChange={(e) => onChange({ originalWithAppliance: e.target.checked })}
            error={errors.originalWithAppliance}
          />
        </div>
        {!row.originalWithAppliance && (
          <TextField label="Installed on" type="date" value={row.installedOn} onChange={(e) => onChange({ installedOn: e.target.value })} error={errors.installedOn} />
        )}
        {row.originalWithAppliance && errors.installedOn && (
          <p role="alert" className="text-sm font-semibold text-due">
            ⚠ {errors.installedOn.join(' ')}
          </p>
        )}
        <TextField label="Note (optional)" value={row.note} onChange={(e) => onChange({ note: e.target.value })} error={errors.note} />
      </div>
    </li>
  );
}

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

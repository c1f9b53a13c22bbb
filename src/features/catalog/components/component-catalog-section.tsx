import { useState, type FormEvent } from 'react';
import { catalogPatch, type CatalogEntryDto } from '@shared/schemas/records';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { Spinner } from '@/components/ui/page';
import { StatusBadge } from '@/components/ui/status-badge';
import { useComponentTypes } from '@/lib/resources/component-types';
import { useUpdateComponentType } from '../api/update-component-type';
import { describeFailure, zodFieldErrors } from '@/lib/form-errors';
import { PART_GROUP_LABELS, partGroupName, RECORD_WORDS } from '@shared/glossary';


export function ComponentCatalogSection() {
  const types = useComponentTypes();
  const groups = Object.keys(PART_GROUP_LABELS).concat([...new Set((types.data ?? []).map((t) => t.group))].filter((g) => !(g in PART_GROUP_LABELS)));
  return (
    <Card title={<span id="part-types">{RECORD_WORDS.partTypes}</span>}>
      <p className="mb-3 text-sm text-iron-muted">
        The part types your technicians pick from. Rename one to your shop&rsquo;s word for it. A deactivated type is no longer
        offered for new parts; parts already recorded keep it and stay readable.
      </p>
      {types.isPending && <Spinner />}
      {types.isError && <Notice kind="danger" title="Could not load the part types">{types.error.message}</Notice>}
      {groups.map((g) => {
        const entries = (types.data ?? []).filter((t) => t.group === g);
        if (!entries.length) return null;
        return (
          <section key={g} className="mb-4">
            <h3 className="mb-1 font-semibold">{partGroupName(g)}</h3>
            <ul className="divide-y divide-plate-line rounded-plate border border-plate-line">
              {entries.map((t) => (
                <CatalogRow key={t.code} entry={t} />
              ))}
            </ul>
          </section>
        );
      })}
    </Card>
  );
}

/** The spec fields' names ("length, diameter"), read defensively since the contract types them unknown[]. */
const specLabels = (entry: CatalogEntryDto) =>
  entry.specFields.flatMap((f) => (typeof f === 'object' && f !== null && 'label' in f && typeof f.label === 'string' ? [f.label] : []));

function CatalogRow({ entry }: { entry: CatalogEntryDto }) {
  const update = useUpdateComponentType();
  const [renaming, setRenaming] = useState(false);
  const [label, setLabel] = useState(entry.label);
  const [error, setError] = useState<string[] | undefined>();
  const [failure, setFailure] = useState<string | null>(null);

  async function save(body: { label?: string; active?: boolean }) {
    setFailure(null);
    const parsed = catalogPatch.safeParse(body);
    if (!parsed.success) return setError(zodFieldErrors(parsed.error).label);
    setError(undefined);
    try {
      await update.mutateAsync({ code: entry.code, body: parsed.data });
      setRenaming(false);
    } catch (err) {
      const { fields, message } = describeFailure(err);
      setError(fields.label);
      setFailure(fields.label ? null : message);
    }
  }

  return (
    <li className="flex flex-wrap items-center gap-3 px-3 py-2">
      {renaming ? (
        <form
          className="flex flex-1 flex-wrap items-end gap-2"
          noValidate
          onSubmit={(e: FormEvent) => {
            e.preventDefault();
            void save({ label });
          }}
        >
          <div className="min-w-56 flex-1">
            <TextField label={`New name for "${entry.label}"`} value={label} onChange={(e) => setLabel(e.target.value)} error={error} />
          </div>
          <Button type="submit" disabled={update.isPending}>
            Save name
          </Button>
          <Button variant="secondary" onClick={() => setRenaming(false)}>
            Cancel
          </Button>
        </form>
      ) : (
        <>
          <div className="min-w-48 flex-1">
            <p className={`font-semibold ${entry.active ? '' : 'text-iron-muted line-through'}`}>{entry.label}</p>
            {specLabels(entry).length > 0 && <p className="text-xs text-iron-muted">Told apart by {specLabels(entry).join(', ')}</p>}
          </div>
          {entry.active ? <StatusBadge status="ok">Active</StatusBadge> : <StatusBadge status="info">Deactivated</StatusBadge>}
          <Button variant="ghost" onClick={() => setRenaming(true)} aria-label={`Rename ${entry.label}`}>
            Rename
          </Button>
          <Button
            variant="secondary"
            disabled={update.isPending}
            onClick={() => void save({ active: !entry.active })}
            aria-label={`${entry.active ? 'Deactivate' : 'Reactivate'} ${entry.label}`}
          >
            {entry.active ? 'Deactivate' : 'Reactivate'}
          </Button>
        </>
      )}
      {failure && (
        <p role="alert" className="w-full text-sm font-semibold text-due">
          ⚠ {failure}
        </p>
      )}
    </li>
  );
}

import type { CatalogEntryDto } from '@shared/schemas/records';
import { Card } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import type { FieldErrors } from '@/lib/api-client';
import { newComponentDraft, type ComponentDraft } from './appliance-draft';
import { ComponentRow } from './component-row';
import { errorsUnder } from '@/lib/form-errors';

export function ComponentsSection({
  rows,
  setRows,
  catalog,
  catalogError,
  suggestions,
  suggestionFor,
  errors,
  steamOrHotWater,
}: {
  rows: ComponentDraft[];
  setRows: (update: (rows: ComponentDraft[]) => ComponentDraft[]) => void;
  catalog: CatalogEntryDto[];
  catalogError: string | null;
  /** Starter parts for the chosen kind and fuel that are not on the list yet. */
  suggestions: CatalogEntryDto[];
  suggestionFor: string | null;
  errors: FieldErrors;
  steamOrHotWater: boolean;
}) {
  const update = (rowId: number, patch: Partial<ComponentDraft>) =>
    setRows((rs) => rs.map((r) => (r.rowId === rowId ? { ...r, ...patch, untouchedSuggestion: false } : r)));
  const remove = (rowId: number) => setRows((rs) => rs.filter((r) => r.rowId !== rowId));
  const listErrors = errors.components;

  return (
    <Card
      title="Parts on this appliance"
      action={
        <Button variant="secondary" onClick={() => setRows((rs) => [...rs, newComponentDraft()])}>
          + Add part
        </Button>
      }
    >
      <p className="mb-3 text-sm text-iron-muted">
        Parts tracked here get their own inspection and replacement dates. Give each part its install date, or tick
        &ldquo;original with the appliance&rdquo; when it came with it.
      </p>
      {catalogError && <Notice kind="danger" title="Could not load the part types">{catalogError}</Notice>}
      {listErrors?.map((m) => (
        <p key={m} role="alert" className="mb-2 font-semibold text-due">
          ⚠ {m}
        </p>
      ))}
      {steamOrHotWater && (
        <div className="mb-3">
          <Notice kind="caution" title="Safety controls">
            Low-water cutoffs, safety and relief valves keep a boiler from running dry or over pressure. Test and replace
            them only as the manufacturer&rsquo;s instructions, local codes and licensed practice require.
          </Notice>
        </div>
      )}
      {suggestions.length > 0 && suggestionFor && (
        <div className="mb-3 flex flex-wrap items-center gap-3 rounded-plate border border-dashed border-brass bg-brass-light/40 p-3">
          <p className="flex-1 text-sm">
            <span className="font-semibold">Usual parts for {suggestionFor}:</span> {suggestions.map((s) => s.label).join(', ')}.
          </p>
          <Button
            variant="secondary"
            onClick={() => setRows((rs) => [...rs, ...suggestions.map((s) => newComponentDraft(s.code, true))])}
          >
            Add {suggestions.length === 1 ? 'this part' : `these ${suggestions.length} parts`}
          </Button>
        </div>
      )}
      {rows.length === 0 ? (
        <p className="text-iron-muted">No parts yet. Choose the kind and fuel above for the usual set, or add parts one by one.</p>
      ) : (
        <ol className="flex flex-col gap-3">
          {rows.map((row, i) => (
            <ComponentRow
              key={row.rowId}
              index={i}
              row={row}
              catalog={catalog}
              errors={errorsUnder(errors, `components.${i}`)}
              onChange={(patch) => update(row.rowId, patch)}
              onRemove={() => remove(row.rowId)}
            />
          ))}
        </ol>
      )}
      {rows.length > 0 && (
        <div className="mt-3">
          <Button variant="secondary" onClick={() => setRows((rs) => [...rs, newComponentDraft()])}>
            + Add another part
          </Button>
        </div>
      )}
    </Card>
  );
}

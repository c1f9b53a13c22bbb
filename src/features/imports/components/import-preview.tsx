import type { ImportCounts, ImportPreviewDto } from '@shared/schemas/imports';
import { Card } from '@/components/ui/card';

const ENTITIES: { key: keyof ImportCounts; label: string }[] = [
  { key: 'customers', label: 'Customers' },
  { key: 'sites', label: 'Sites' },
  { key: 'appliances', label: 'Appliances' },
  { key: 'parts', label: 'Parts' },
  { key: 'visits', label: 'Past visits' },
];

export function CountsTable({ counts, caption }: { counts: ImportCounts; caption: string }) {
  return (
    <table className="w-full text-left text-sm">
      <caption className="mb-1 text-left font-semibold">{caption}</caption>
      <thead>
        <tr className="border-b-2 border-plate-line">
          <th scope="col" className="py-1 pr-3">Records</th>
          <th scope="col" className="py-1 pr-3 text-right">New</th>
          <th scope="col" className="py-1 pr-3 text-right">Found, details added</th>
          <th scope="col" className="py-1 text-right">Already there</th>
        </tr>
      </thead>
      <tbody>
        {ENTITIES.map((e) => (
          <tr key={e.key} className="border-b border-plate-line">
            <th scope="row" className="py-1 pr-3 font-normal">{e.label}</th>
            <td className="py-1 pr-3 text-right tabular-nums">{counts[e.key].create}</td>
            <td className="py-1 pr-3 text-right tabular-nums">{counts[e.key].update}</td>
            <td className="py-1 text-right tabular-nums">{counts[e.key].skip}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** The dry run: nothing is written yet. The errors first, since they are what needs doing. */
export function ImportPreview({ preview }: { preview: ImportPreviewDto }) {
  return (
    <div className="flex flex-col gap-4">
      <Card title={preview.errorRows ? `${preview.errorRows} row${preview.errorRows === 1 ? '' : 's'} cannot be imported as they are` : 'Every row can be imported'}>
        {preview.errorRows > 0 ? (
          <>
            <p className="mb-2 text-sm text-iron-muted">These rows are left out; the rest can go in now. After the import you can download them to fix and upload again.</p>
            <ul aria-label="Rows with errors" className="flex max-h-80 flex-col gap-1 overflow-y-auto text-sm">
              {preview.errors.map((e) => (
                <li key={`${e.row}-${e.field}`}>
                  <span className="font-semibold">row {e.row}</span>, {e.column}: {e.message}
                </li>
              ))}
            </ul>
            {preview.errorCount > preview.errors.length && <p className="mt-1 text-sm">…and {preview.errorCount - preview.errors.length} more.</p>}
          </>
        ) : (
          <p className="text-sm">No errors found.</p>
        )}
      </Card>
      <Card title="What the import would do">
        <CountsTable counts={preview.counts} caption="Nothing is written until you press Import." />
      </Card>
      <Card title={`The first ${preview.rows.length} rows as they will be stored`}>
        <ol className="flex flex-col gap-2 text-sm">
          {preview.rows.map((r) => (
            <li key={r.row} className="border-b border-plate-line pb-2">
              <p className="font-semibold">Row {r.row}: {r.customer}</p>
              <p>{r.site}</p>
              <p>{r.appliance}</p>
              {r.parts.length > 0 && <p className="text-iron-muted">Parts: {r.parts.join('; ')}</p>}
              {r.visits.length > 0 && <p className="text-iron-muted">Visits: {r.visits.join('; ')}</p>}
            </li>
          ))}
        </ol>
      </Card>
    </div>
  );
}

import { IMPORT_FIELD_KEYS, IMPORT_FIELDS, type ImportField, type ImportMapping } from '@shared/imports/import-fields';

const GROUPS: { title: string; match: (f: ImportField) => boolean }[] = [
  { title: 'Customer', match: (f) => f.startsWith('customer') },
  { title: 'Site', match: (f) => f.startsWith('site') },
  { title: 'Appliance', match: (f) => !f.startsWith('customer') && !f.startsWith('site') && !f.startsWith('part') && !f.startsWith('visit') },
  { title: 'Parts on it', match: (f) => f.startsWith('part') },
  { title: 'Past visits', match: (f) => f.startsWith('visit') },
];

const isRequired = (f: ImportField) => 'required' in IMPORT_FIELDS[f];

/** One select per field we import: which column of the file it is read from, or none. */
export function MappingForm({
  headers,
  mapping,
  errors,
  onChange,
}: {
  headers: string[];
  mapping: ImportMapping;
  errors: Record<string, string[]>;
  onChange: (mapping: ImportMapping) => void;
}) {
  const usedBy = new Map(Object.entries(mapping).map(([f, h]) => [h, f as ImportField]));
  return (
    <div className="grid gap-4 md:grid-cols-2">
      {GROUPS.map((g) => (
        <fieldset key={g.title} className="rounded-plate border-2 border-plate-line p-3">
          <legend className="px-1 font-semibold">{g.title}</legend>
          <div className="grid gap-2">
            {IMPORT_FIELD_KEYS.filter(g.match).map((field) => {
              const id = `map-${field}`;
              const error = errors[`mapping.${field}`];
              return (
                <div key={field} className="grid gap-1 sm:grid-cols-[12rem_1fr] sm:items-center">
                  <label htmlFor={id} className="text-sm font-semibold">
                    {IMPORT_FIELDS[field].label}
                    {isRequired(field) && <span className="text-due"> (needed)</span>}
                  </label>
                  <div>
                    <select
                      id={id}
                      aria-invalid={Boolean(error)}
                      className="min-h-tap w-full rounded-plate border-2 border-plate-line bg-surface px-2 text-base text-iron aria-[invalid=true]:border-due"
                      value={mapping[field] ?? ''}
                      onChange={(e) => {
                        const next = { ...mapping };
                        if (e.target.value) next[field] = e.target.value;
                        else delete next[field];
                        onChange(next);
                      }}
                    >
                      <option value="">Not in this file</option>
                      {headers.map((h) => (
                        <option key={h} value={h} disabled={usedBy.has(h) && usedBy.get(h) !== field}>
                          {h}
                          {usedBy.has(h) && usedBy.get(h) !== field ? ` (read as ${IMPORT_FIELDS[usedBy.get(h)!].label})` : ''}
                        </option>
                      ))}
                    </select>
                    {error?.map((m) => (
                      <p key={m} role="alert" className="text-sm font-semibold text-due">
                        ⚠ {m}
                      </p>
                    ))}
                  </div>
                </div>
              );
            })}
          </div>
        </fieldset>
      ))}
    </div>
  );
}

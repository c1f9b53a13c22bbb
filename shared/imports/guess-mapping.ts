import { IMPORT_FIELD_KEYS, IMPORT_FIELDS, type ImportField, type ImportMapping } from './import-fields';

/** "Serial No." → "serial no": case, spacing, underscores and punctuation do not matter when matching headers. */
export const normaliseHeader = (header: string) =>
  header
    .toLowerCase()
    .replace(/[_\-.#:()]+/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();

/**
 * Guesses which column each field comes from. A column the company mapped by hand before (`remembered`, keyed by
 * the normalised header) wins; then the field's own label and synonyms. A column is used for one field only.
 */
export function guessMapping(headers: readonly string[], remembered: Readonly<Record<string, ImportField>> = {}): ImportMapping {
  const mapping: ImportMapping = {};
  const used = new Set<string>();
  const take = (field: ImportField, header: string) => {
    if (mapping[field] || used.has(header)) return;
    mapping[field] = header;
    used.add(header);
  };
  for (const header of headers) {
    const field = remembered[normaliseHeader(header)];
    if (field && IMPORT_FIELD_KEYS.includes(field)) take(field, header);
  }
  for (const field of IMPORT_FIELD_KEYS) {
    const def = IMPORT_FIELDS[field];
    const names = new Set([normaliseHeader(def.label), normaliseHeader(field.replace(/([A-Z])/g, ' $1')), ...def.synonyms.map(normaliseHeader)]);
    const header = headers.find((h) => !used.has(h) && names.has(normaliseHeader(h)));
    if (header) take(field, header);
  }
  return mapping;
}

/** What to remember of a mapping for the company's next file: normalised header → field. */
export function mappingMemory(mapping: ImportMapping): Record<string, ImportField> {
  const out: Record<string, ImportField> = {};
  for (const [field, header] of Object.entries(mapping)) if (header) out[normaliseHeader(header)] = field as ImportField;
  return out;
}

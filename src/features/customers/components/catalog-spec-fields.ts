import type { CatalogEntryDto } from '@shared/schemas/records';
import { COMPONENT_TYPES, type SpecField } from '@shared/trade';
import { PART_GROUP_LABELS, partGroupName } from '@shared/glossary';

/** A spec field as the form shows it, whichever of the catalog's stored shapes it came from. */
export type FormSpecField =
  | { key: string; label: string; kind: 'number'; unit: string | null }
  | { key: string; label: string; kind: 'text' }
  | { key: string; label: string; kind: 'choice'; options: { value: string; label: string }[] };

const UNIT_TEXT: Record<string, string> = { in: 'in', psi: 'psi', gph: 'gph', deg: '°', degF: '°F', gal: 'gal', V: 'V', btu_per_hour: 'Btu/h' };
export const unitText = (unit: string | null) => (unit ? (UNIT_TEXT[unit] ?? unit) : '');

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * The catalog's specFields are typed unknown[] in the contract: the trade definitions keep choice options as
 * { value: label }, the stored rows may keep them as a list. Both are read; anything else is skipped.
 */
export function formSpecFields(entry: CatalogEntryDto | undefined): FormSpecField[] {
  if (!entry) return [];
  const out: FormSpecField[] = [];
  for (const raw of entry.specFields) {
    if (!isRecord(raw) || typeof raw.key !== 'string') continue;
    const label = typeof raw.label === 'string' ? raw.label : raw.key;
    if (raw.kind === 'number') out.push({ key: raw.key, label, kind: 'number', unit: typeof raw.unit === 'string' ? raw.unit : null });
    else if (raw.kind === 'choice') {
      const known = tradeOptionLabels(entry.code, raw.key);
      const options = Array.isArray(raw.options)
        ? raw.options.filter((o): o is string => typeof o === 'string').map((o) => ({ value: o, label: known[o] ?? o.replace(/_/g, ' ') }))
        : isRecord(raw.options)
          ? Object.entries(raw.options).map(([value, l]) => ({ value, label: String(l) }))
          : [];
      out.push({ key: raw.key, label, kind: 'choice', options });
    } else out.push({ key: raw.key, label, kind: 'text' });
  }
  return out;
}

/** Stored rows keep only the option codes; the trade definitions know their words ("semi_solid" → "semi-solid"). */
function tradeOptionLabels(code: string, key: string): Record<string, string> {
  const def = (COMPONENT_TYPES as Record<string, { specFields: readonly SpecField[] }>)[code];
  const field = def?.specFields.find((f) => f.key === key);
  return field?.kind === 'choice' ? field.options : {};
}

const GROUP_ORDER = Object.keys(PART_GROUP_LABELS);

/** Active catalog entries grouped for an <optgroup> list, in the trade's usual order. */
export function groupedEntries(entries: CatalogEntryDto[]): { group: string; label: string; entries: CatalogEntryDto[] }[] {
  const groups = new Map<string, CatalogEntryDto[]>();
  for (const e of entries) {
    if (!e.active) continue;
    groups.set(e.group, [...(groups.get(e.group) ?? []), e]);
  }
  return [...groups.entries()]
    .sort(([a], [b]) => (GROUP_ORDER.indexOf(a) + 1 || 99) - (GROUP_ORDER.indexOf(b) + 1 || 99))
    .map(([group, list]) => ({ group, label: partGroupName(group), entries: list.sort((x, y) => x.label.localeCompare(y.label)) }));
}

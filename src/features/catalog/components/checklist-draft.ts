import type { ChecklistTemplateDto } from '@shared/schemas/records';

export type ItemDraft = { rowId: number; key: string; section: string; label: string; caution: string; readings?: string[] };
export type TemplateDraft = { name: string; items: ItemDraft[] };

let nextRowId = 1;
export const newItemDraft = (section = ''): ItemDraft => ({ rowId: nextRowId++, key: '', section, label: '', caution: '' });

export const toTemplateDraft = (t: ChecklistTemplateDto): TemplateDraft => ({
  name: t.name,
  items: t.items.map((i) => ({ rowId: nextRowId++, key: i.key, section: i.section, label: i.label, caution: i.caution ?? '', readings: i.readings })),
});

const slug = (label: string) =>
  label
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^_+|_+$/g, '')
    .slice(0, 50) || 'item';

/**
 * Existing items keep their key: every visit's copy of the checklist names its items by key. A new item gets a key
 * made from its label, unique within the template.
 */
export function toTemplateBody(draft: TemplateDraft) {
  const used = new Set(draft.items.map((i) => i.key).filter(Boolean));
  return {
    name: draft.name,
    items: draft.items.map((i) => {
      let key = i.key;
      if (!key) {
        const base = slug(i.label);
        key = base;
        for (let n = 2; used.has(key); n++) key = `${base}_${n}`;
        used.add(key);
      }
      return { key, section: i.section, label: i.label, caution: i.caution, ...(i.readings?.length ? { readings: i.readings } : {}) };
    }),
  };
}

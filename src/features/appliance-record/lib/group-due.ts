import type { ApplianceRecordDto } from '@shared/schemas/records';

export type DueItem = ApplianceRecordDto['due'][number];
export type DueGroup = { key: string; kind: DueItem['kind']; dueOn: string; status: DueItem['status']; items: DueItem[] };

/** Parts due the same way on the same day read as one line ("9 inspections due Jan 6, 2027"); input order is kept. */
export function groupDue(items: DueItem[]): DueGroup[] {
  const groups = new Map<string, DueGroup>();
  for (const item of items) {
    const key = `${item.status}|${item.kind}|${item.dueOn}`;
    const group = groups.get(key) ?? { key, kind: item.kind, dueOn: item.dueOn, status: item.status, items: [] };
    group.items.push(item);
    groups.set(key, group);
  }
  return [...groups.values()];
}

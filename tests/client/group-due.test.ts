import { describe, expect, it } from 'vitest';
import { groupDue, type DueItem } from '@/features/appliance-record/lib/group-due';

const item = (componentId: string, over: Partial<DueItem>): DueItem => ({
  componentId,
  typeLabel: componentId,
  kind: 'inspection',
  dueOn: '2027-01-06',
  status: 'due_soon',
  reason: 'Inspection is due',
  ...over,
});

describe('groupDue', () => {
  it('makes one line per status, kind and day, in the order the record sorted them', () => {
    const groups = groupDue([
      item('gauge glass', { kind: 'replacement', status: 'replace_now' }),
      item('cutoff', {}),
      item('burner', {}),
      item('valve', { dueOn: '2027-02-01' }),
      item('pilot', { kind: 'replacement' }),
    ]);
    expect(groups.map((g) => [g.status, g.kind, g.dueOn, g.items.map((i) => i.componentId)])).toEqual([
      ['replace_now', 'replacement', '2027-01-06', ['gauge glass']],
      ['due_soon', 'inspection', '2027-01-06', ['cutoff', 'burner']],
      ['due_soon', 'inspection', '2027-02-01', ['valve']],
      ['due_soon', 'replacement', '2027-01-06', ['pilot']],
    ]);
  });
});

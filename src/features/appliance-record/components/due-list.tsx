import { StatusBadge } from '@/components/ui/status-badge';
import type { ApplianceRecordDto } from '@shared/schemas/records';
import { formatDueDate } from '@shared/format/dates';
import { groupDue, type DueGroup } from '../lib/group-due';
import { dueStatus } from '../lib/labels';
import { Section } from './section';
import { RECORD_SECTIONS } from '@shared/glossary';

const KIND_WORDS = { inspection: ['inspection', 'inspections'], replacement: ['replacement', 'replacements'] } as const;

/**
 * What needs doing first: replace now, overdue and due soon, one line per day and kind that opens to its parts;
 * what is due later is folded, so the start button and today's work share the phone's first screen.
 */
export function DueList({ due, today }: { due: ApplianceRecordDto['due']; today: string }) {
  const now = groupDue(due.filter((d) => d.status !== 'ok'));
  const later = groupDue(due.filter((d) => d.status === 'ok'));
  const laterCount = later.reduce((n, g) => n + g.items.length, 0);
  return (
    <Section title={RECORD_SECTIONS.whatIsDue}>
      {due.length === 0 && <p>Nothing due is recorded.</p>}
      {due.length > 0 && now.length === 0 && <p>Nothing is due soon.</p>}
      {now.length > 0 && (
        <ul className="flex flex-col divide-y divide-plate-line">
          {now.map((g) => (
            <DueLine key={g.key} group={g} today={today} />
          ))}
        </ul>
      )}
      {laterCount > 0 && (
        <details className="mt-2">
          <summary className="flex min-h-tap cursor-pointer items-center font-semibold">Later: {laterCount} {laterCount === 1 ? 'item' : 'items'}</summary>
          <ul className="flex flex-col divide-y divide-plate-line">
            {later.map((g) => (
              <DueLine key={g.key} group={g} today={today} />
            ))}
          </ul>
        </details>
      )}
    </Section>
  );
}

function DueLine({ group, today }: { group: DueGroup; today: string }) {
  const s = dueStatus(group.status);
  const [one, many] = KIND_WORDS[group.kind];
  const when = group.status === 'replace_now' ? 'now' : `due ${formatDueDate(group.dueOn, today)}`;
  const headline =
    group.items.length === 1 ? `${group.items[0].typeLabel}: ${one} ${when}` : `${group.items.length} ${many} ${when}`;
  return (
    <li>
      <details>
        <summary className="flex min-h-tap cursor-pointer flex-wrap items-center justify-between gap-2 py-1">
          <span className="font-semibold">{headline}</span>
          <StatusBadge status={s.status}>{s.word}</StatusBadge>
        </summary>
        <ul className="mb-2 flex flex-col gap-1 pl-3 text-sm">
          {group.items.map((d) => (
            <li key={`${d.componentId}-${d.kind}`}>
              <span className="font-semibold">{d.typeLabel}</span> · {d.reason}
            </li>
          ))}
        </ul>
      </details>
    </li>
  );
}

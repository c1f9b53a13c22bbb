import { StatusBadge } from '@/components/ui/status-badge';
import type { ApplianceRecordDto } from '@shared/schemas/records';
import { dueStatus, formatDate } from '../lib/labels';
import { Section } from './section';

type DueItem = ApplianceRecordDto['due'][number];

export function DueList({ due }: { due: ApplianceRecordDto['due'] }) {
  const inspections = due.filter((d) => d.kind === 'inspection');
  const replacements = due.filter((d) => d.kind === 'replacement');
  return (
    <Section title="What is due">
      {due.length === 0 ? (
        <p>Nothing due is recorded.</p>
      ) : (
        <div className="flex flex-col gap-3">
          {replacements.length > 0 && <DueGroup title="Replace" items={replacements} />}
          {inspections.length > 0 && <DueGroup title="Inspect" items={inspections} />}
        </div>
      )}
    </Section>
  );
}

function DueGroup({ title, items }: { title: string; items: DueItem[] }) {
  return (
    <div>
      <h3 className="font-bold">{title}</h3>
      <ul className="divide-y divide-plate-line">
        {items.map((d) => {
          const s = dueStatus(d.status);
          return (
            <li key={`${d.componentId}-${d.kind}`} className="flex flex-col gap-1 py-2">
              <div className="flex flex-wrap items-center justify-between gap-2">
                <span className="font-semibold">{d.typeLabel}</span>
                <StatusBadge status={s.status}>{s.word}</StatusBadge>
              </div>
              <span className="text-sm">
                {formatDate(d.dueOn)} · {d.reason}
              </span>
            </li>
          );
        })}
      </ul>
    </div>
  );
}

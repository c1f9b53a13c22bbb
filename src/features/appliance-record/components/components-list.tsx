import { StatusBadge } from '@/components/ui/status-badge';
import type { ComponentDto } from '@shared/schemas/records';
import { dueStatus, formatDate } from '../lib/labels';
import { Section } from './section';
import { RECORD_SECTIONS } from '@shared/glossary';

export function ComponentsList({ components }: { components: ComponentDto[] }) {
  const current = components.filter((c) => !c.removedOn);
  const removed = components.filter((c) => c.removedOn);
  return (
    <Section folded title={RECORD_SECTIONS.parts} summary={`${current.length} in service${removed.length ? `, ${removed.length} removed` : ''}`}>
      {current.length === 0 ? (
        <p>No parts recorded.</p>
      ) : (
        <ul className="divide-y divide-plate-line">
          {current.map((c) => (
            <CurrentPart key={c.id} c={c} />
          ))}
        </ul>
      )}
      {removed.length > 0 && (
        <details className="mt-2">
          <summary className="flex min-h-tap cursor-pointer items-center font-semibold">Removed parts ({removed.length})</summary>
          <ul className="divide-y divide-plate-line">
            {removed.map((c) => (
              <li key={c.id} className="py-2 text-sm">
                <span className="font-semibold">{c.typeLabel}</span> {c.specKey && `· ${c.specKey}`} · removed {formatDate(c.removedOn)}
                {c.removalReason ? ` · ${c.removalReason}` : ''}
              </li>
            ))}
          </ul>
        </details>
      )}
    </Section>
  );
}

function CurrentPart({ c }: { c: ComponentDto }) {
  const s = c.due ? dueStatus(c.due.status) : null;
  return (
    <li className="flex flex-col gap-1 py-2" data-component={c.typeCode}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <span className="font-semibold">
          {c.typeLabel}
          {c.specKey ? ` · ${c.specKey}` : ''}
        </span>
        {s && <StatusBadge status={s.status}>{s.word}</StatusBadge>}
        {c.conditionFailed && <StatusBadge status="due">Failed check</StatusBadge>}
      </div>
      {c.description && <span className="text-sm">{c.description}</span>}
      <span className="text-sm text-iron-muted">
        {c.installedOn ? `Installed ${formatDate(c.installedOn)}` : c.originalWithAppliance ? 'Original with the appliance' : 'Install date unknown'}
        {c.lastInspectedOn ? ` · checked ${formatDate(c.lastInspectedOn)}` : ''}
      </span>
    </li>
  );
}

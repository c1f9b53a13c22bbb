import type { ReactNode } from 'react';
import { Link, useLocation } from 'react-router-dom';

/**
 * The due list's sections, one shown at a time under a jump bar of links (each with its count). The section is kept
 * in the address (`/due#annual-services`), so a link, a reload and the browser's Back all open the same section.
 * Printing shows every section.
 */
export const DUE_SECTIONS = [
  { id: 'due-parts', label: 'Due parts' },
  { id: 'stock-forecast', label: 'Stock forecast' },
  { id: 'annual-services', label: 'Annual services' },
  { id: 'replacement-prospects', label: 'Replacement prospects' },
  { id: 'reminders-sent', label: 'Reminders sent' },
] as const;
export type DueSectionId = (typeof DUE_SECTIONS)[number]['id'];

export function useDueSection(): DueSectionId {
  const hash = useLocation().hash.replace(/^#/, '');
  return DUE_SECTIONS.find((s) => s.id === hash)?.id ?? DUE_SECTIONS[0].id;
}

/** Counts are shown once known; a count of a first page only ends in "+". */
export function DueJumpBar({ current, counts }: { current: DueSectionId; counts: Partial<Record<DueSectionId, string>> }) {
  return (
    <nav aria-label="Due list sections" className="no-print">
      <ul className="flex flex-wrap gap-2">
        {DUE_SECTIONS.map((s) => {
          const active = s.id === current;
          return (
            <li key={s.id}>
              <Link
                to={{ hash: s.id }}
                aria-current={active ? 'true' : undefined}
                className={`inline-flex min-h-tap items-center gap-2 rounded-plate border px-3 font-semibold ${
                  active ? 'border-iron bg-iron text-plate' : 'border-plate-line bg-surface text-iron underline-offset-2 hover:underline'
                }`}
              >
                {s.label}
                {counts[s.id] !== undefined && (
                  <span className={`tabular rounded-full px-2 text-sm ${active ? 'bg-plate text-iron' : 'bg-plate-deep'}`}>{counts[s.id]}</span>
                )}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}

/** One section: shown when it is the current one, and always on paper. */
export function DueSection({ id, current, children }: { id: DueSectionId; current: DueSectionId; children: ReactNode }) {
  return (
    <div id={id} className={id === current ? 'flex flex-col gap-4' : 'hidden print:flex print:flex-col print:gap-4'}>
      {children}
    </div>
  );
}

import type { ReactNode } from 'react';

type SectionProps = { title: string; action?: ReactNode; children: ReactNode; /** Folded until opened: long reading below the first screen. */ folded?: boolean; summary?: string };

/** A block on the record; plate colours so it stays high-contrast in dim (basement) mode. */
export function Section({ title, action, children, folded = false, summary }: SectionProps) {
  const box = 'rounded-plate border-2 border-plate-line bg-plate-deep p-3 text-iron';
  if (folded) {
    return (
      <section className={box} aria-label={title}>
        <details>
          <summary className="flex min-h-tap cursor-pointer flex-wrap content-center items-baseline gap-x-2">
            <h2 className="text-lg font-bold">{title}</h2>
            {summary && <span className="text-sm text-iron-muted">{summary}</span>}
          </summary>
          {action && <div className="my-2">{action}</div>}
          {children}
        </details>
      </section>
    );
  }
  return (
    <section className={box} aria-label={title}>
      <header className="mb-2 flex items-center justify-between gap-2">
        <h2 className="text-lg font-bold">{title}</h2>
        {action}
      </header>
      {children}
    </section>
  );
}

/** One term and its value; `wide` spans both columns of the record's two-column list (a <dl> allows only div groups). */
export function Fact({ label, children, wide = false }: { label: string; children: ReactNode; wide?: boolean }) {
  return (
    <div className={`flex flex-col ${wide ? 'col-span-2' : ''}`}>
      <dt className="text-xs font-semibold uppercase tracking-wide text-iron-muted">{label}</dt>
      <dd className="font-semibold">{children}</dd>
    </div>
  );
}

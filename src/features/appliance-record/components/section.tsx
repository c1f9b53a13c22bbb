import type { ReactNode } from 'react';

/** A block on the record; plate colours so it stays high-contrast in dim (basement) mode. */
export function Section({ title, action, children }: { title: string; action?: ReactNode; children: ReactNode }) {
  return (
    <section className="rounded-plate border-2 border-plate-line bg-plate-deep p-3 text-iron" aria-label={title}>
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

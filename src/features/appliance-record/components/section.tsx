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

export function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="flex flex-col">
      <dt className="text-xs font-semibold uppercase tracking-wide text-iron-muted">{label}</dt>
      <dd className="font-semibold">{children}</dd>
    </div>
  );
}

import { useEffect, type ReactNode } from 'react';

/** Each page names itself in the browser's tab and to screen readers (WCAG 2.2 SC 2.4.2 Page Titled). */
export function useDocumentTitle(title: string) {
  useEffect(() => {
    document.title = `${title} · Lifeplate`;
  }, [title]);
}

type PageProps = { title: string; subtitle?: ReactNode; actions?: ReactNode; children: ReactNode; /** Boards and wide tables use the whole screen. */ wide?: boolean };

export function Page({ title, subtitle, actions, children, wide = false }: PageProps) {
  useDocumentTitle(title);
  return (
    <div className={`mx-auto flex w-full ${wide ? 'max-w-none' : 'max-w-5xl'} flex-col gap-4 px-3 py-4 sm:px-6`}>
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">{title}</h1>
          {subtitle && <p className="text-iron-muted">{subtitle}</p>}
        </div>
        {actions}
      </header>
      {children}
    </div>
  );
}

export function Spinner({ label = 'Loading…' }: { label?: string }) {
  return (
    <p role="status" className="p-4 text-iron-muted">
      {label}
    </p>
  );
}

import type { ReactNode } from 'react';

const tone = {
  caution: 'border-soon bg-soon-soft',
  danger: 'border-unsafe bg-white text-unsafe',
  info: 'border-plate-line bg-plate-deep',
};

export function Notice({ kind = 'info', title, children }: { kind?: keyof typeof tone; title?: string; children: ReactNode }) {
  return (
    <div role={kind === 'danger' ? 'alert' : 'note'} className={`rounded-plate border-l-4 p-3 text-sm ${tone[kind]}`}>
      {title && <p className="font-bold">{kind === 'danger' ? '⛔ ' : kind === 'caution' ? '⚠ ' : ''}{title}</p>}
      <div className={kind === 'danger' ? 'text-iron' : ''}>{children}</div>
    </div>
  );
}

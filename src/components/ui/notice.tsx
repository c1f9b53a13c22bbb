import type { ReactNode } from 'react';
import { Icon } from './icons';

const tone = {
  caution: { cls: 'border-soon bg-soon-soft', icon: 'caution' as const, iconCls: 'text-soon' },
  danger: { cls: 'border-unsafe bg-unsafe-soft', icon: 'stop' as const, iconCls: 'text-unsafe' },
  info: { cls: 'border-plate-line bg-plate-deep', icon: 'info' as const, iconCls: 'text-iron' },
  done: { cls: 'border-ok bg-ok-soft', icon: 'check' as const, iconCls: 'text-ok' },
};

export function Notice({ kind = 'info', title, children }: { kind?: keyof typeof tone; title?: string; children: ReactNode }) {
  const t = tone[kind];
  return (
    <div role={kind === 'danger' ? 'alert' : kind === 'done' ? 'status' : 'note'} className={`rounded-plate border-l-4 p-3 text-sm text-iron ${t.cls}`}>
      {title && (
        <p className={`flex items-start gap-1.5 font-bold ${kind === 'danger' ? 'text-unsafe' : ''}`}>
          <Icon name={t.icon} className={`mt-0.5 h-4 w-4 ${t.iconCls}`} />
          {title}
        </p>
      )}
      <div>{children}</div>
    </div>
  );
}

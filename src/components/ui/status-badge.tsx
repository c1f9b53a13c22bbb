import { Icon } from './icons';

export type Status = 'ok' | 'soon' | 'due' | 'unsafe' | 'info';

const look: Record<Status, { icon: Parameters<typeof Icon>[0]['name']; cls: string }> = {
  ok: { icon: 'check', cls: 'bg-ok-soft text-ok border-ok' },
  soon: { icon: 'clock', cls: 'bg-soon-soft text-soon border-soon' },
  due: { icon: 'alert', cls: 'bg-due-soft text-due border-due' },
  unsafe: { icon: 'stop', cls: 'bg-unsafe-soft text-unsafe border-unsafe border-2' },
  info: { icon: 'info', cls: 'bg-plate-deep text-iron border-plate-line' },
};

/** Colour never stands alone: each status shows an icon and a word. */
export function StatusBadge({ status, children }: { status: Status; children: string }) {
  const { icon, cls } = look[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold whitespace-nowrap ${cls}`}>
      <Icon name={icon} />
      {children}
    </span>
  );
}

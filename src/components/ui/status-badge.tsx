export type Status = 'ok' | 'soon' | 'due' | 'unsafe' | 'info';

const look: Record<Status, { icon: string; cls: string }> = {
  ok: { icon: '✓', cls: 'bg-ok-soft text-ok border-ok' },
  soon: { icon: '◷', cls: 'bg-soon-soft text-soon border-soon' },
  due: { icon: '!', cls: 'bg-due-soft text-due border-due' },
  unsafe: { icon: '⛔', cls: 'bg-white text-unsafe border-unsafe border-2' },
  info: { icon: 'i', cls: 'bg-plate-deep text-iron border-plate-line' },
};

/** Colour never stands alone: each status shows an icon and a word. */
export function StatusBadge({ status, children }: { status: Status; children: string }) {
  const { icon, cls } = look[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold ${cls}`}>
      <span aria-hidden="true">{icon}</span>
      {children}
    </span>
  );
}

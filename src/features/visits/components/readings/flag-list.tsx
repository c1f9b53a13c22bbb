import type { TradeFlag } from '@shared/trade/index';

const LOOK = {
  stop: { icon: '✖', word: 'Stop', cls: 'border-unsafe text-unsafe' },
  warning: { icon: '!', word: 'Warning', cls: 'border-due text-due' },
  info: { icon: 'i', word: 'Note', cls: 'border-plate-line' },
} as const;

const fmt = (n: number) => (Math.abs(n) >= 100 ? Math.round(n).toLocaleString('en-US') : String(Number(n.toFixed(2))));

/** Each finding with its number, the limit it was compared with, and where that limit comes from. */
export function FlagList({ flags }: { flags: TradeFlag[] }) {
  if (flags.length === 0) return null;
  return (
    <ul className="flex flex-col gap-2">
      {flags.map((f) => {
        const look = LOOK[f.severity];
        return (
          <li key={f.code} className={`rounded-plate border-l-4 bg-plate p-2 text-sm ${look.cls}`} data-flag={f.code}>
            <p className="font-bold">
              <span aria-hidden="true">{look.icon} </span>
              {look.word}
            </p>
            <p className="text-iron">{f.message}</p>
            {f.value != null && f.threshold != null && (
              <p className="tabular text-iron">
                {fmt(f.value)} against {fmt(f.threshold)} {f.unit ?? ''}
              </p>
            )}
            <p className="text-xs text-iron-muted">Source: {f.source}</p>
          </li>
        );
      })}
    </ul>
  );
}

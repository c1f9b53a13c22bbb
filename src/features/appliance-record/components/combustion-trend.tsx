import { useTimeline } from '../api/get-timeline';
import { formatDate } from '../lib/labels';
import { trendPoints, type TrendPoint } from '../lib/reading-trend';
import { Section } from './section';
import { RECORD_SECTIONS } from '@shared/glossary';

const fmt = (n: number | null, digits = 0) => (n == null ? '—' : n.toFixed(digits));

export function CombustionTrend({ applianceId }: { applianceId: string }) {
  const readings = useTimeline(applianceId, 'reading');
  const points = trendPoints(readings.data?.pages.flatMap((p) => p.items) ?? []);
  if (readings.isPending || points.length === 0) return null;
  return (
    <Section folded title={RECORD_SECTIONS.combustionTrend}>
      <Sparkline points={points} />
      <table className="tabular w-full text-left text-sm">
        <thead>
          <tr className="border-b-2 border-plate-line">
            <th className="py-1 font-semibold">Date</th>
            <th className="py-1 text-right font-semibold">Eff. %</th>
            <th className="py-1 text-right font-semibold">CO air-free</th>
            <th className="py-1 text-right font-semibold">Flue °F</th>
          </tr>
        </thead>
        <tbody>
          {[...points].reverse().map((p) => (
            <tr key={p.at} className="border-b border-plate-line">
              <td className="py-1">{formatDate(p.at)}</td>
              <td className="py-1 text-right">{fmt(p.efficiencyPct, 1)}</td>
              <td className="py-1 text-right">{fmt(p.coAirFreePpm)}</td>
              <td className="py-1 text-right">{fmt(p.flueTempF)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-iron-muted">Efficiency on the HHV basis; CO in ppm, air-free.</p>
    </Section>
  );
}

/** Efficiency across visits as a plain line, drawn only when there are two or more. */
function Sparkline({ points }: { points: TrendPoint[] }) {
  const values = points.map((p) => p.efficiencyPct).filter((v): v is number => v != null);
  if (values.length < 2) return null;
  const min = Math.min(...values) - 1;
  const max = Math.max(...values) + 1;
  const w = 300;
  const h = 60;
  const xy = values.map((v, i) => `${((i / (values.length - 1)) * (w - 8) + 4).toFixed(1)},${(h - 4 - ((v - min) / (max - min)) * (h - 8)).toFixed(1)}`);
  return (
    <svg viewBox={`0 0 ${w} ${h}`} className="mb-2 h-16 w-full" role="img" aria-label={`Efficiency from ${values[0].toFixed(1)} % to ${values[values.length - 1].toFixed(1)} %`}>
      <polyline points={xy.join(' ')} fill="none" stroke="currentColor" strokeWidth="2.5" />
      {xy.map((p) => {
        const [x, y] = p.split(',');
        return <circle key={p} cx={x} cy={y} r="3.5" fill="currentColor" />;
      })}
    </svg>
  );
}

import { formatBtuh } from '@shared/format/quantities';
import { describeGaugeGlassLevel, type CombustionAnalysis, type GaugeGlassAssessment, type ThermocoupleAssessment, type TradeFlag } from '@shared/trade/index';
import { FlagList } from './readings/flag-list';

type StoredResults = {
  combustion?: CombustionAnalysis;
  gasInput?: { cubicFeetPerHour: number; inputBtuPerHour: number };
  thermocouple?: ThermocoupleAssessment;
  gaugeGlass?: GaugeGlassAssessment;
  lowWaterCutoff?: { type: 'float' | 'probe'; passed: boolean; trippedWith?: 'water_visible' | 'below_visible' | null };
  flags?: TradeFlag[];
};

/** The results the server computed and stored at the last save: these, not the phone's live numbers, are the record. */
export function ServerResults({ results, title = 'Kept with the visit' }: { results: Record<string, unknown>; title?: string }) {
  const r = results as StoredResults;
  const rows: [string, string][] = [];
  if (r.combustion) {
    rows.push(['CO2', `${r.combustion.co2Pct.toFixed(1)} %`]);
    rows.push(['Excess air', `${r.combustion.excessAirPct.toFixed(0)} %`]);
    rows.push(['CO air-free', `${r.combustion.coAirFreePpm.toFixed(0)} ppm`]);
    rows.push(['Efficiency (HHV)', r.combustion.efficiencyPct == null ? 'not applicable' : `${r.combustion.efficiencyPct.toFixed(1)} %`]);
  }
  if (r.gasInput) rows.push(['Gas input', formatBtuh(r.gasInput.inputBtuPerHour)]);
  if (r.thermocouple) rows.push(['Thermocouple', r.thermocouple.reason]);
  if (r.gaugeGlass) rows.push(['Gauge glass', describeGaugeGlassLevel(r.gaugeGlass)]);
  if (r.lowWaterCutoff) rows.push(['Low-water cutoff', cutoffText(r.lowWaterCutoff)]);
  if (rows.length === 0) return null;
  return (
    <div className="flex flex-col gap-2 rounded-plate border-2 border-plate-line bg-plate p-3" role="region" aria-label={title}>
      <p className="text-sm font-bold">{title} (computed by the server)</p>
      <dl className="tabular grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
        {rows.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="font-semibold">{k}</dt>
            <dd data-result={k}>{v}</dd>
          </div>
        ))}
      </dl>
      <FlagList flags={(r.flags ?? []).filter((f) => f.severity !== 'info')} />
    </div>
  );
}

function cutoffText(c: NonNullable<StoredResults['lowWaterCutoff']>): string {
  if (c.passed) return c.trippedWith === 'water_visible' ? 'Stopped the burner with water visible in the glass (passed)' : 'Stopped the burner (passed)';
  return c.trippedWith === 'below_visible' ? 'Stopped only with the water out of sight below the glass (failed)' : 'Did not stop the burner (failed)';
}

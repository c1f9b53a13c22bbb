import { formatBtuh } from '@shared/format/quantities';
import { describeGaugeGlassLevel, type CombustionAnalysis, type GaugeGlassAssessment, type ThermocoupleAssessment, type TradeFlag } from '@shared/trade/index';
import { RESULT_WORDS, STORED_RESULTS_NOTE, type ResultWords } from '@shared/glossary';
import { FlagList } from './readings/flag-list';

type StoredResults = {
  combustion?: CombustionAnalysis;
  gasInput?: { cubicFeetPerHour: number; inputBtuPerHour: number };
  thermocouple?: ThermocoupleAssessment;
  gaugeGlass?: GaugeGlassAssessment;
  lowWaterCutoff?: { type: 'float' | 'probe'; passed: boolean; trippedWith?: 'water_visible' | 'below_visible' | null };
  flags?: TradeFlag[];
};

/** How a combustion result was worked out (formula and source), from the analysis itself; older stored results may lack it. */
export function combustionWorking(c: Partial<Pick<CombustionAnalysis, 'sources' | 'efficiencyBasis'>>): string[] {
  const s = c.sources;
  if (!s) return [];
  return [
    `Carbon dioxide: ${s.co2}`,
    `Air-free CO: ${s.coAirFree}`,
    `Excess air and efficiency: ${s.excessAirAndEfficiency}${c.efficiencyBasis ? ` (${c.efficiencyBasis})` : ''}`,
  ];
}

/** How it was worked out, folded away until asked for. */
export function Working({ lines }: { lines: string[] }) {
  if (!lines.length) return null;
  return (
    <details className="text-xs text-iron-muted">
      <summary className="min-h-tap cursor-pointer content-center font-semibold">How these are worked out</summary>
      <ul className="flex flex-col gap-1">
        {lines.map((l) => (
          <li key={l}>{l}</li>
        ))}
      </ul>
    </details>
  );
}

/** The results stored with the visit at the last save, worked out from the readings: these, not the phone's live numbers, are the record. */
export function ServerResults({ results, title = 'Kept with the visit' }: { results: Record<string, unknown>; title?: string }) {
  const r = results as StoredResults;
  const rows: [ResultWords, string][] = [];
  if (r.combustion) {
    rows.push([RESULT_WORDS.co2, `${r.combustion.co2Pct.toFixed(1)} %`]);
    rows.push([RESULT_WORDS.excessAir, `${r.combustion.excessAirPct.toFixed(0)} %`]);
    rows.push([RESULT_WORDS.coAirFree, `${r.combustion.coAirFreePpm.toFixed(0)} ppm`]);
    rows.push([RESULT_WORDS.efficiency, r.combustion.efficiencyPct == null ? 'not applicable' : `${r.combustion.efficiencyPct.toFixed(1)} %`]);
  }
  if (r.gasInput) rows.push([RESULT_WORDS.gasInput, formatBtuh(r.gasInput.inputBtuPerHour)]);
  if (r.thermocouple) rows.push([RESULT_WORDS.thermocouple, r.thermocouple.reason]);
  if (r.gaugeGlass) rows.push([RESULT_WORDS.gaugeGlass, describeGaugeGlassLevel(r.gaugeGlass)]);
  if (r.lowWaterCutoff) rows.push([RESULT_WORDS.lowWaterCutoff, cutoffText(r.lowWaterCutoff)]);
  if (rows.length === 0) return null;
  return (
    <div className="flex flex-col gap-2 rounded-plate border-2 border-plate-line bg-plate p-3" role="region" aria-label={title}>
      <p className="text-sm font-bold">{title}</p>
      <p className="text-xs text-iron-muted">{STORED_RESULTS_NOTE}</p>
      <dl className="tabular grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
        {rows.map(([w, v]) => (
          <div key={w.label} className="contents">
            <dt className="font-semibold">{w.label}</dt>
            <dd>
              <span data-result={w.label}>{v}</span>
              <span className="block text-xs text-iron-muted">{w.meaning}</span>
            </dd>
          </div>
        ))}
      </dl>
      {r.combustion && <Working lines={combustionWorking(r.combustion)} />}
      <FlagList flags={(r.flags ?? []).filter((f) => f.severity !== 'info')} />
    </div>
  );
}

function cutoffText(c: NonNullable<StoredResults['lowWaterCutoff']>): string {
  if (c.passed) return c.trippedWith === 'water_visible' ? 'Stopped the burner with water visible in the glass (passed)' : 'Stopped the burner (passed)';
  return c.trippedWith === 'below_visible' ? 'Stopped only with the water out of sight below the glass (failed)' : 'Did not stop the burner (failed)';
}

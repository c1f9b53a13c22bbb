import { useState } from 'react';
import { Notice } from '@/components/ui/notice';
import { LIVE_RESULTS_NOTE, RESULT_WORDS, type ResultWords } from '@shared/glossary';
import { combustionWorking, Working } from '../server-results';
import { FlagList } from './flag-list';
import { WarmUpTimer } from './warm-up-timer';
import { NumberField } from '../inputs';
import { useDraft, useReading } from '../draft-context';
import { plain, pressure, temperature } from '../../lib/unit-prefs';

const fmt = (n: number, digits = 1) => n.toFixed(digits);

export function CombustionReadings() {
  const { visitId, prefs } = useDraft();
  const { value: c, set, field } = useReading('combustion');
  const temp = temperature(prefs);
  const press = pressure(prefs);
  return (
    <div className="flex flex-col gap-3">
      <Notice kind="caution" title="Carbon monoxide can kill">
        If CO is high or the appliance spills, stop and make the appliance safe. Follow the manufacturer&apos;s instructions, local codes and licensed
        practice.
      </Notice>
      <WarmUpTimer visitId={visitId} onStop={(minutes) => set({ steadyFiringMinutes: minutes })} />
      <div className="grid grid-cols-2 gap-2">
        <NumberField label="O2" converter={plain('%', 1)} value={c?.o2Pct} onChange={(v) => set({ o2Pct: v })} {...field('o2Pct')} />
        <NumberField label="CO" converter={plain('ppm', 0)} value={c?.coPpm} onChange={(v) => set({ coPpm: v })} {...field('coPpm')} />
        <NumberField key={`flue-${temp.unit}`} label="Flue temp" converter={temp} value={c?.flueTempF} onChange={(v) => set({ flueTempF: v })} {...field('flueTempF')} />
        <NumberField key={`air-${temp.unit}`} label="Air temp" converter={temp} value={c?.airTempF} onChange={(v) => set({ airTempF: v })} {...field('airTempF')} />
        <NumberField
          key={`draft-${press.unit}`}
          label="Draft"
          converter={press}
          allowNegative
          value={c?.draftInWc}
          onChange={(v) => set({ draftInWc: v })}
          {...field('draftInWc')}
        />
        <NumberField label="Ambient CO" converter={plain('ppm', 0)} value={c?.ambientCoPpm} onChange={(v) => set({ ambientCoPpm: v })} {...field('ambientCoPpm')} />
        <NumberField label="Spillage" converter={plain('s', 0)} value={c?.spillageSeconds} onChange={(v) => set({ spillageSeconds: v })} {...field('spillageSeconds')} />
        <NumberField
          key={`outdoor-${temp.unit}`}
          label="Outdoor temp"
          converter={temp}
          allowNegative
          value={c?.outdoorTempF}
          onChange={(v) => set({ outdoorTempF: v })}
          {...field('outdoorTempF')}
        />
        <NumberField
          label="Steady firing"
          converter={plain('min', 1)}
          value={c?.steadyFiringMinutes}
          onChange={(v) => set({ steadyFiringMinutes: v })}
          {...field('steadyFiringMinutes')}
        />
      </div>
      <CombustionLive />
    </div>
  );
}

function CombustionLive() {
  const { live, appliance } = useDraft();
  const r = live.combustion;
  if (!r) return <p className="text-sm text-iron-muted">Fill in O2, CO, flue and air temperature to see the results.</p>;
  if (!r.ok) return <p role="alert" className="text-sm font-semibold text-due">⚠ {r.message}</p>;
  const a = r.value;
  return (
    <div className="flex flex-col gap-2 rounded-plate border-2 border-iron bg-plate p-3" aria-label="Live combustion results" role="region">
      <p className="text-xs font-semibold uppercase tracking-wide text-iron-muted">Live on this phone</p>
      <p className="text-xs text-iron-muted">{LIVE_RESULTS_NOTE}</p>
      <dl className="tabular grid grid-cols-2 gap-2">
        <Result words={RESULT_WORDS.co2} value={`${fmt(a.co2Pct)} %`} />
        <Result words={RESULT_WORDS.excessAir} value={`${fmt(a.excessAirPct, 0)} %`} />
        <Result words={RESULT_WORDS.coAirFree} value={`${fmt(a.coAirFreePpm, 0)} ppm`} />
        <Result
          words={RESULT_WORDS.efficiency}
          value={a.efficiencyPct == null ? 'not applicable' : `${fmt(a.efficiencyPct)} %`}
          note={a.efficiencyPct == null && appliance?.construction === 'condensing' ? 'Not worked out for a condensing appliance.' : undefined}
        />
      </dl>
      <Working lines={combustionWorking(a)} />
      <FlagList flags={a.flags} />
      <SiegertLoss lossPct={a.siegertLossPct} basis={a.siegertBasis} />
    </div>
  );
}

/**
 * The Siegert flue-gas loss is on the net (lower heating value) basis, so 100 minus it is not the HHV efficiency above.
 * It stays folded away unless asked for, and always carries its basis.
 */
function SiegertLoss({ lossPct, basis }: { lossPct: number; basis: string }) {
  const [open, setOpen] = useState(false);
  return (
    <div className="text-sm">
      <button type="button" className="min-h-tap font-semibold underline" aria-expanded={open} onClick={() => setOpen(!open)}>
        {open ? 'Hide' : 'Show'} flue-gas loss (Siegert, net basis)
      </button>
      {open && (
        <p className="tabular">
          Flue-gas loss <strong>{fmt(lossPct)} %</strong>, net basis. Not comparable with the HHV efficiency above. <span className="text-xs text-iron-muted">({basis})</span>
        </p>
      )}
    </div>
  );
}

function Result({ words, value, note }: { words: ResultWords; value: string; note?: string }) {
  return (
    <div className="flex flex-col">
      <dt className="text-sm">{words.label}</dt>
      <dd className="text-xl font-bold" data-live={words.label}>
        {value}
      </dd>
      <dd className="text-xs text-iron-muted">{note ?? words.meaning}</dd>
    </div>
  );
}

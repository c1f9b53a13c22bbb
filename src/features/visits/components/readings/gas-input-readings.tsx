import { formatBtuh } from '@shared/format/quantities';
import { StatusBadge } from '@/components/ui/status-badge';
import { altitudeDerateNote, DEFAULT_HEATING_VALUE_BTU_PER_FT3, HEATING_VALUE_SOURCE } from '@shared/trade/index';
import { ChoiceButtons, NumberField } from '../inputs';
import { useDraft, useReading } from '../draft-context';
import { plain } from '../../lib/unit-prefs';

const DIALS = [0.5, 1, 2, 5];

export function GasInputReadings() {
  const { appliance, live, elevationFt } = useDraft();
  const derateNote = elevationFt === null ? null : altitudeDerateNote(elevationFt);
  const { value: g, set, errorFor, field } = useReading('gasInput');
  const fuel = appliance?.fuel === 'propane' ? 'propane' : 'natural_gas';
  const defaultHv = DEFAULT_HEATING_VALUE_BTU_PER_FT3[fuel];
  // The heating value starts at the published default for the fuel; the technician may use the utility's figure.
  const setWithDefault = (patch: Parameters<typeof set>[0]) => set({ heatingValueBtuPerCubicFoot: g?.heatingValueBtuPerCubicFoot ?? defaultHv, ...(patch as object) });
  const r = live.gasInput;
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm">Clock the meter with every other gas appliance off.</p>
      {derateNote && (
        <p className="text-sm" data-note="altitude-derate">
          {derateNote}
        </p>
      )}
      <div className="flex flex-col gap-1">
        <span className="text-sm font-semibold">Test dial (ft³ per revolution)</span>
        <ChoiceButtons
          label="Test dial"
          choices={DIALS.map((d) => ({ value: String(d), label: d === 0.5 ? '½' : String(d) }))}
          value={g?.dialCubicFeet == null ? null : String(g.dialCubicFeet)}
          onChange={(v) => setWithDefault({ dialCubicFeet: v == null ? null : Number(v) })}
        />
        {errorFor('dialCubicFeet')?.map((m) => <p key={m} role="alert" className="text-sm font-semibold text-due">⚠ {m}</p>)}
      </div>
      <div className="grid grid-cols-2 gap-2">
        <NumberField label="One revolution" converter={plain('s', 1)} value={g?.secondsPerRevolution} onChange={(v) => setWithDefault({ secondsPerRevolution: v })} {...field('secondsPerRevolution')} />
        <NumberField
          label="Heating value"
          converter={plain('Btu/ft³', 0)}
          value={g?.heatingValueBtuPerCubicFoot ?? defaultHv}
          onChange={(v) => set({ heatingValueBtuPerCubicFoot: v })}
          {...field('heatingValueBtuPerCubicFoot')}
          hint={`Default ${defaultHv.toLocaleString('en-US')} for ${fuel === 'propane' ? 'propane' : 'natural gas'} (${HEATING_VALUE_SOURCE})`}
        />
      </div>
      {r && !r.ok && <p role="alert" className="text-sm font-semibold text-due">⚠ {r.message}</p>}
      {r?.ok && (
        <div className="tabular rounded-plate border-2 border-iron bg-plate p-3" role="region" aria-label="Live gas input">
          <p className="text-xs font-semibold uppercase tracking-wide text-iron-muted">Live on this phone</p>
          <p className="text-xl font-bold">{formatBtuh(r.value.inputBtuPerHour)}</p>
          <p className="text-sm">{r.value.cubicFeetPerHour.toFixed(1)} ft³/h</p>
          {r.value.rating && (
            <p className="mt-1 flex flex-wrap items-center gap-2 text-sm">
              {r.value.rating.status === 'over_fired' ? (
                <StatusBadge status="due">Over-fired</StatusBadge>
              ) : r.value.rating.status === 'under_fired' ? (
                <StatusBadge status="soon">Under-fired</StatusBadge>
              ) : (
                <StatusBadge status="ok">Not over the rating</StatusBadge>
              )}
              {r.value.rating.deviationPct >= 0 ? '+' : ''}
              {r.value.rating.deviationPct.toFixed(0)} % against {r.value.rating.altitudeDeratePct > 0 ? 'the derated rating' : 'the nameplate'}{' '}
              {Math.round(r.value.rating.allowedBtuPerHour).toLocaleString('en-US')} Btu/h
            </p>
          )}
          {r.value.rating && (
            <p className="text-xs text-iron-muted">
              Within {r.value.rating.overFiringTolerancePct} % above the rating counts as within it: clocking a meter cannot tell a couple of per cent apart.
            </p>
          )}
          {r.value.rating?.status === 'over_fired' && <p className="text-xs text-iron-muted">Source: {r.value.rating.source}</p>}
        </div>
      )}
    </div>
  );
}

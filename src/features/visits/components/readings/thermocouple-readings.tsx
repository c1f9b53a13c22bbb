import { StatusBadge, type Status } from '@/components/ui/status-badge';
import type { ThermocoupleAssessment } from '@shared/trade/index';
import { NumberField } from '../inputs';
import { useDraft, useReading } from '../draft-context';
import { plain } from '../../lib/unit-prefs';

const LOOK: Record<ThermocoupleAssessment['status'], { status: Status; word: string }> = {
  replace: { status: 'due', word: 'Replace' },
  below_typical: { status: 'soon', word: 'Below typical' },
  typical: { status: 'ok', word: 'Typical' },
  above_typical: { status: 'info', word: 'Above typical' },
  see_manufacturer: { status: 'info', word: 'See the valve maker' },
};

export function ThermocoupleReadings() {
  const { live } = useDraft();
  const { value: t, set, field } = useReading('thermocouple');
  const r = live.thermocouple;
  return (
    <div className="flex flex-col gap-3">
      <div className="grid grid-cols-2 gap-2">
        <NumberField label="Open circuit" converter={plain('mV', 1)} value={t?.openCircuitMv} onChange={(v) => set({ openCircuitMv: v })} {...field('openCircuitMv')} />
        <NumberField label="Closed circuit" converter={plain('mV', 1)} value={t?.closedCircuitMv} onChange={(v) => set({ closedCircuitMv: v })} {...field('closedCircuitMv')} />
      </div>
      {r && !r.ok && <p role="alert" className="text-sm font-semibold text-due">⚠ {r.message}</p>}
      {r?.ok && (
        <div className="flex flex-col gap-1 rounded-plate border-2 border-iron bg-plate p-3 text-sm" role="region" aria-label="Live thermocouple check">
          <StatusBadge status={LOOK[r.value.status].status}>{LOOK[r.value.status].word}</StatusBadge>
          <p>{r.value.reason}</p>
          <p className="text-xs text-iron-muted">Source: {r.value.source}</p>
        </div>
      )}
    </div>
  );
}

import { StatusBadge } from '@/components/ui/status-badge';
import { describeGaugeGlassLevel } from '@shared/trade/index';
import { TextInput } from '../inputs';
import { useDraft, useReading } from '../draft-context';
import { FlagList } from './flag-list';

export function GaugeGlassReading() {
  const { live } = useDraft();
  const { value, set, errorFor } = useReading('gaugeGlassLevel');
  const r = live.gaugeGlass;
  return (
    <div className="flex flex-col gap-2">
      <TextInput
        label="Water level in the gauge glass"
        placeholder="e.g. 5/8"
        maxLength={20}
        value={value ?? ''}
        onChange={(v) => set(v)}
        error={r && !r.ok ? [r.message] : errorFor()}
        hint="Read it cold. A fraction of the visible glass (1/2, 5/8, empty, full), or against the maker's normal-water-line mark: at mark, below mark, above mark."
        field="readings.gaugeGlassLevel"
      />
      {r?.ok && (
        <div className="flex flex-col gap-2">
          <p className="flex items-center gap-2 text-sm">
            <StatusBadge status={r.value.status === 'ok' ? 'ok' : r.value.status === 'stop' ? 'unsafe' : 'due'}>
              {r.value.status === 'ok' ? 'Level visible' : r.value.status === 'stop' ? 'No water visible' : 'Check the level'}
            </StatusBadge>
            <span className="tabular">{describeGaugeGlassLevel(r.value)}</span>
          </p>
          <FlagList flags={r.value.flags} />
        </div>
      )}
    </div>
  );
}

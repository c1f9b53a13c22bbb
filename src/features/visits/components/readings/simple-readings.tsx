import { NumberField } from '../inputs';
import { useDraft, useReading } from '../draft-context';
import { plain, pressure } from '../../lib/unit-prefs';
import type { ReadingKey } from '../../draft/draft-fields';

const PSI: Partial<Record<ReadingKey, string>> = {
  steamOperatingPsi: 'Operating pressure',
  pressureControlCutInPsi: 'Pressure control cut-in',
  pressureControlCutOutPsi: 'Pressure control cut-out',
  fillPressurePsi: 'Fill pressure',
  expansionTankPrechargePsi: 'Expansion tank pre-charge',
};
const IN_WC: Partial<Record<ReadingKey, string>> = { gasInletInWc: 'Gas inlet pressure', gasManifoldInWc: 'Manifold pressure' };

export const isScalarReading = (key: string) => key in PSI || key in IN_WC;

type ScalarKey = 'steamOperatingPsi' | 'pressureControlCutInPsi' | 'pressureControlCutOutPsi' | 'fillPressurePsi' | 'expansionTankPrechargePsi' | 'gasInletInWc' | 'gasManifoldInWc';

export function ScalarReading({ readingKey }: { readingKey: ScalarKey }) {
  const { prefs } = useDraft();
  const { value, set, field } = useReading(readingKey);
  const inWc = readingKey in IN_WC;
  const converter = inWc ? pressure(prefs) : plain('psi', 1);
  return (
    <NumberField
      key={converter.unit}
      label={(inWc ? IN_WC : PSI)[readingKey] ?? readingKey}
      converter={converter}
      value={value as number | null | undefined}
      onChange={(v) => set(v)}
      {...field()}
    />
  );
}

export function OilReadings() {
  const { prefs } = useDraft();
  const { value: o, set, field } = useReading('oil');
  const press = pressure(prefs);
  return (
    <div className="grid grid-cols-2 gap-2">
      <NumberField label="Smoke spot" converter={plain('0–9', 0)} value={o?.smokeSpot} onChange={(v) => set({ smokeSpot: v })} {...field('smokeSpot')} />
      <NumberField label="Pump pressure" converter={plain('psi', 0)} value={o?.pumpPressurePsi} onChange={(v) => set({ pumpPressurePsi: v })} {...field('pumpPressurePsi')} />
      <NumberField label="Nozzle (at 100 psi)" converter={plain('gph', 2)} value={o?.nozzleGph} onChange={(v) => set({ nozzleGph: v })} {...field('nozzleGph')} />
      <label className="col-span-2 flex flex-col gap-1 text-sm">
        Burner type
        <select
          className="rounded border px-2 py-2"
          value={o?.burnerType ?? ''}
          onChange={(e) => set({ burnerType: e.target.value === '' ? null : (e.target.value as 'flame_retention' | 'non_retention') })}
        >
          <option value="">Not known</option>
          <option value="flame_retention">Flame-retention</option>
          <option value="non_retention">Older, non-retention</option>
        </select>
      </label>
      <p className="col-span-2 text-sm">
        Caution: the pump and nozzle line carry oil at over 100 psi and the burner fires when the control calls. Take the pump pressure with
        the burner off-cycle or as the burner maker instructs; follow local codes and licensed practice.
      </p>
      <NumberField key={`of-${press.unit}`} label="Over-fire draft" allowNegative converter={press} value={o?.overFireDraftInWc} onChange={(v) => set({ overFireDraftInWc: v })} {...field('overFireDraftInWc')} />
      <NumberField key={`br-${press.unit}`} label="Breech draft" allowNegative converter={press} value={o?.breechDraftInWc} onChange={(v) => set({ breechDraftInWc: v })} {...field('breechDraftInWc')} />
    </div>
  );
}

export function MakeupWaterReadings() {
  const { value: m, set, field } = useReading('makeupWater');
  return (
    <div className="grid grid-cols-2 gap-2">
      <NumberField label="Feeder meter" converter={plain('gal', 1)} value={m?.meterGallons} onChange={(v) => set({ meterGallons: v })} {...field('meterGallons')} />
      <NumberField label="Added by hand" converter={plain('gal', 1)} value={m?.addedByHandGallons} onChange={(v) => set({ addedByHandGallons: v })} {...field('addedByHandGallons')} />
    </div>
  );
}

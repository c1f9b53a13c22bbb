import { Notice } from '@/components/ui/notice';
import { ChoiceButtons, TextInput } from '../inputs';
import { useReading } from '../draft-context';

export function LowWaterCutoffReading() {
  const { value: w, set, errorFor } = useReading('lowWaterCutoff');
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-col gap-1" data-field="readings.lowWaterCutoff.type">
        <span className="text-sm font-semibold">Cutoff type</span>
        <ChoiceButtons
          label="Cutoff type"
          choices={[
            { value: 'float', label: 'Float' },
            { value: 'probe', label: 'Probe' },
          ]}
          value={w?.type}
          onChange={(v) => set({ type: v })}
        />
        {errorFor('type')?.map((m) => <p key={m} role="alert" className="text-sm font-semibold text-due">⚠ {m}</p>)}
      </div>
      <div className="flex flex-col gap-1" data-field="readings.lowWaterCutoff.trippedWith">
        <span className="text-sm font-semibold">Where was the water when the burner stopped?</span>
        <ChoiceButtons
          label="Where was the water when the burner stopped?"
          choices={[
            { value: 'water_visible', label: 'Still visible in the glass', icon: '✓', tone: 'ok' },
            { value: 'below_visible', label: 'Below the lowest visible part', icon: '✗', tone: 'due' },
          ]}
          value={w?.trippedWith ?? undefined}
          onChange={(v) => set({ trippedWith: v })}
        />
        <p className="text-sm">The cutoff must stop the burner while water still shows in the glass (ASME Section IV).</p>
        {errorFor('trippedWith')?.map((m) => <p key={m} role="alert" className="text-sm font-semibold text-due">⚠ {m}</p>)}
      </div>
      <TextInput
        label="Level in the glass when it tripped"
        placeholder="e.g. 1/4"
        maxLength={20}
        value={w?.trippedAtLevel ?? ''}
        onChange={(v) => set({ trippedAtLevel: v })}
        error={errorFor('trippedAtLevel')}
        field="readings.lowWaterCutoff.trippedAtLevel"
      />
      <div className="flex flex-col gap-1" data-field="readings.lowWaterCutoff.burnerStopped">
        <span className="text-sm font-semibold">Did the burner stop?</span>
        <ChoiceButtons
          label="Did the burner stop?"
          choices={[
            { value: true, label: 'Yes, it stopped', icon: '✓', tone: 'ok' },
            { value: false, label: 'No, it kept firing', icon: '✗', tone: 'due' },
          ]}
          value={w?.burnerStopped}
          onChange={(v) => set({ burnerStopped: v })}
        />
        {errorFor('burnerStopped')?.map((m) => <p key={m} role="alert" className="text-sm font-semibold text-due">⚠ {m}</p>)}
      </div>
      {w?.burnerStopped === true && w.trippedWith === 'below_visible' && (
        <Notice kind="danger" title="Low-water cutoff failed">
          The burner stopped only after the water had gone out of sight below the glass. Do not add water to a hot boiler whose water is out of sight: shut
          the burner off, let it cool, and choose “Shut down as unsafe” below unless the cutoff is repaired and passes the test.
        </Notice>
      )}
      {w?.burnerStopped === false && (
        <Notice kind="danger" title="Low-water cutoff failed">
          The burner kept firing at low water. Shut the boiler down and tell the customer before you leave; choose “Shut down as unsafe” below unless it
          is repaired and passes the test.
        </Notice>
      )}
    </div>
  );
}

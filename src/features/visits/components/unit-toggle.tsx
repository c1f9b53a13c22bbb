import { ChoiceButtons } from './inputs';
import { useUnitPrefs } from '../lib/unit-prefs';

/** The units this phone shows; readings are stored the same whatever is chosen here. */
export function UnitToggle() {
  const [prefs, setPrefs] = useUnitPrefs();
  return (
    <div className="grid grid-cols-2 gap-2" aria-label="Units on this phone" role="group">
      <ChoiceButtons
        label="Temperature unit"
        choices={[
          { value: 'F', label: '°F' },
          { value: 'C', label: '°C' },
        ]}
        value={prefs.temp}
        onChange={(temp) => temp && setPrefs({ temp })}
      />
      <ChoiceButtons
        label="Draft and gas pressure unit"
        choices={[
          { value: 'inwc', label: 'in. w.c.' },
          { value: 'pa', label: 'Pa' },
        ]}
        value={prefs.pressure}
        onChange={(pressure) => pressure && setPrefs({ pressure })}
      />
    </div>
  );
}

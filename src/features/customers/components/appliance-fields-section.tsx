import { APPLIANCE_KINDS, CONSTRUCTIONS, FUELS, IGNITION_TYPES, LABELS, VENT_TYPES } from '@shared/schemas/enums';
import { Card } from '@/components/ui/card';
import { SelectField, TextField } from '@/components/ui/field';
import type { FieldErrors } from '@/lib/api-client';
import { isOil, type ApplianceDraft } from './appliance-draft';

export const APPLIANCE_FIELD_KEYS: readonly string[] = [
  'siteId',
  'kind',
  'fuel',
  'construction',
  'manufacturer',
  'model',
  'serial',
  'inputBtuh',
  'firingRateGph',
  'grossOutputBtuh',
  'mawpPsi',
  'manufacturedMonth',
  'manufacturedYear',
  'installedOn',
  'location',
  'ignitionType',
  'burnerCount',
  'ventType',
];

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

function Options<T extends string>({ values, labels, placeholder }: { values: readonly T[]; labels: Record<T, string>; placeholder: string }) {
  return (
    <>
      <option value="">{placeholder}</option>
      {values.map((v) => (
        <option key={v} value={v}>
          {labels[v]}
        </option>
      ))}
    </>
  );
}

export function ApplianceFieldsSection({
  draft,
  errors,
  onChange,
}: {
  draft: ApplianceDraft;
  errors: FieldErrors;
  onChange: <K extends keyof ApplianceDraft>(key: K, value: ApplianceDraft[K]) => void;
}) {
  const text = (key: keyof ApplianceDraft) => ({
    value: draft[key],
    onChange: (e: { target: { value: string } }) => onChange(key, e.target.value as ApplianceDraft[typeof key]),
    error: errors[key],
  });
  const oil = isOil(draft);
  return (
    <Card title="The appliance">
      <div className="grid gap-4 md:grid-cols-3">
        <SelectField label="Kind" {...text('kind')}>
          <Options values={APPLIANCE_KINDS} labels={LABELS.applianceKind} placeholder="Choose the kind…" />
        </SelectField>
        <SelectField label="Fuel" {...text('fuel')}>
          <Options values={FUELS} labels={LABELS.fuel} placeholder="Choose the fuel…" />
        </SelectField>
        <SelectField label="Construction" hint="Decides which published service life applies." {...text('construction')}>
          <Options values={CONSTRUCTIONS} labels={LABELS.construction} placeholder="Choose the construction…" />
        </SelectField>

        <TextField label="Make" hint="As written on the rating plate." autoComplete="off" {...text('manufacturer')} />
        <TextField label="Model" autoComplete="off" {...text('model')} />
        <TextField label="Serial number" autoComplete="off" {...text('serial')} />

        {oil ? (
          <TextField label="Firing rate (gph)" inputMode="decimal" hint="Oil: the rated firing rate in gallons per hour." {...text('firingRateGph')} />
        ) : (
          <TextField label="Input rating (Btu/h)" inputMode="numeric" hint="From the rating plate." {...text('inputBtuh')} />
        )}
        <TextField label="Gross output (Btu/h)" inputMode="numeric" {...text('grossOutputBtuh')} />
        <TextField label="Maximum allowable working pressure (psi)" inputMode="decimal" hint="MAWP, from the rating plate." {...text('mawpPsi')} />

        <SelectField label="Month of manufacture" {...text('manufacturedMonth')}>
          <option value="">Not known</option>
          {MONTHS.map((m, i) => (
            <option key={m} value={String(i + 1)}>
              {m}
            </option>
          ))}
        </SelectField>
        <TextField label="Year of manufacture" inputMode="numeric" placeholder="e.g. 1987" {...text('manufacturedYear')} />
        <TextField label="Install date" type="date" {...text('installedOn')} />

        <TextField label="Location in the building" placeholder="e.g. basement, north wall" autoComplete="off" {...text('location')} />
        <SelectField label="Ignition type" {...text('ignitionType')}>
          <Options values={IGNITION_TYPES} labels={LABELS.ignitionType} placeholder="Choose the ignition…" />
        </SelectField>
        <TextField label="Burner count" inputMode="numeric" {...text('burnerCount')} />

        <SelectField label="Vent type" hint="Decides what draft is expected." {...text('ventType')}>
          <Options values={VENT_TYPES} labels={LABELS.ventType} placeholder="Choose the vent…" />
        </SelectField>
      </div>
    </Card>
  );
}

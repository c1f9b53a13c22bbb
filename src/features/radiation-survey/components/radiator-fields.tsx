import { SelectField, TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { COLUMN_EDR_SQFT_PER_SECTION, RADIATOR_TYPES, TUBE_EDR_SQFT_PER_SECTION, type RadiatorType } from '@shared/trade/radiator-edr';
import { RADIATOR_TYPE_LABELS, WALL_RADIATOR_SIZES } from '@shared/schemas/radiation-surveys';
import { formatEdr } from './format';

/** One radiator as typed: every size field as text, so a half-typed number stays on screen. */
export type RadiatorDraft = {
  key: string;
  type: RadiatorType;
  columns: string;
  tubes: string;
  heightIn: string;
  sections: string;
  size: string;
  ratedEdrSqFt: string;
  lengthFt: string;
  ratedEdrSqFtPerFt: string;
  count: string;
};

export const newRadiator = (key: string): RadiatorDraft => ({
  key,
  type: 'cast_iron_column',
  columns: '2',
  tubes: '4',
  heightIn: '',
  sections: '',
  size: '9-A',
  ratedEdrSqFt: '',
  lengthFt: '',
  ratedEdrSqFtPerFt: '',
  count: '1',
});

const heightsOf = (table: Record<number, Record<number, number>>, n: string) => Object.keys(table[Number(n)] ?? {});

type Props = {
  draft: RadiatorDraft;
  label: string;
  lineEdr: number | null;
  errors: (field: string) => string[] | undefined;
  onChange: (draft: RadiatorDraft) => void;
  onRemove: () => void;
};

export function RadiatorFields({ draft, label, lineEdr, errors, onChange, onRemove }: Props) {
  const set = (patch: Partial<RadiatorDraft>) => onChange({ ...draft, ...patch });
  const sections = <TextField label="Sections" inputMode="numeric" pattern="[0-9]*" value={draft.sections} onChange={(e) => set({ sections: e.target.value })} error={errors('sections')} />;
  const height = (table: Record<number, Record<number, number>>, n: string) => (
    <SelectField label="Height (in)" value={draft.heightIn} onChange={(e) => set({ heightIn: e.target.value })} error={errors('heightIn')}>
      <option value="">Choose</option>
      {heightsOf(table, n).map((h) => (
        <option key={h} value={h}>
          {h} in
        </option>
      ))}
    </SelectField>
  );
  return (
    <fieldset className="grid grid-cols-2 gap-2 rounded-plate border-2 border-plate-line p-2" aria-label={label}>
      <legend className="px-1 text-sm font-semibold">{label}</legend>
      <div className="col-span-2">
        <SelectField label="Type" value={draft.type} onChange={(e) => set({ type: e.target.value as RadiatorType })}>
          {RADIATOR_TYPES.map((t) => (
            <option key={t} value={t}>
              {RADIATOR_TYPE_LABELS[t]}
            </option>
          ))}
        </SelectField>
      </div>
      {draft.type === 'cast_iron_column' && (
        <>
          <SelectField label="Columns" value={draft.columns} onChange={(e) => set({ columns: e.target.value, heightIn: '' })} error={errors('columns')}>
            {Object.keys(COLUMN_EDR_SQFT_PER_SECTION).map((c) => (
              <option key={c} value={c}>
                {c}-column
              </option>
            ))}
          </SelectField>
          {height(COLUMN_EDR_SQFT_PER_SECTION, draft.columns)}
          {sections}
        </>
      )}
      {draft.type === 'tube' && (
        <>
          <SelectField label="Tubes" value={draft.tubes} onChange={(e) => set({ tubes: e.target.value, heightIn: '' })} error={errors('tubes')}>
            {Object.keys(TUBE_EDR_SQFT_PER_SECTION).map((c) => (
              <option key={c} value={c}>
                {c}-tube
              </option>
            ))}
          </SelectField>
          {height(TUBE_EDR_SQFT_PER_SECTION, draft.tubes)}
          {sections}
        </>
      )}
      {draft.type === 'wall' && (
        <>
          <SelectField label="Size" value={draft.size} onChange={(e) => set({ size: e.target.value })} error={errors('size')}>
            {WALL_RADIATOR_SIZES.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </SelectField>
          {sections}
        </>
      )}
      {draft.type === 'convector' && (
        <TextField
          label="Rated EDR (sq ft)"
          hint="From the rating tag or the maker's literature"
          inputMode="decimal"
          value={draft.ratedEdrSqFt}
          onChange={(e) => set({ ratedEdrSqFt: e.target.value })}
          error={errors('ratedEdrSqFt')}
        />
      )}
      {draft.type === 'baseboard' && (
        <>
          <TextField label="Length (ft)" inputMode="decimal" value={draft.lengthFt} onChange={(e) => set({ lengthFt: e.target.value })} error={errors('lengthFt')} />
          <TextField
            label="EDR per foot"
            hint="From the maker's literature"
            inputMode="decimal"
            value={draft.ratedEdrSqFtPerFt}
            onChange={(e) => set({ ratedEdrSqFtPerFt: e.target.value })}
            error={errors('ratedEdrSqFtPerFt')}
          />
        </>
      )}
      <TextField label="How many alike" inputMode="numeric" pattern="[0-9]*" value={draft.count} onChange={(e) => set({ count: e.target.value })} error={errors('count')} />
      <p className="tabular col-span-2 flex items-center justify-between gap-2 font-semibold">
        <span data-testid="radiator-edr">{lineEdr === null ? 'EDR: not yet rated' : `EDR: ${formatEdr(lineEdr)}`}</span>
        <Button variant="ghost" className="min-h-tap" onClick={onRemove}>
          Remove radiator
        </Button>
      </p>
    </fieldset>
  );
}

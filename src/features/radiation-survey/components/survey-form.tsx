import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { HEATING_MEDIA, HEATING_MEDIUM_LABELS, radiationSurveyInput, radiatorLineEdrSqFt, runningTotalEdrSqFt, type RadiationSurveyDto } from '@shared/schemas/radiation-surveys';
import type { HeatingMedium } from '@shared/trade/boiler-sizing';
import { useCreateSurvey } from '../api/create-survey';
import { radiatorInputOf, surveyInputOf, type RoomDraft, type SurveyDraft } from './draft';
import { formatEdr } from './format';
import { newRadiator, RadiatorFields } from './radiator-fields';

// React list keys for rooms and radiators added on this page; never sent.
let lastKey = 0;
const key = () => `k${++lastKey}`;
const room = (): RoomDraft => ({ key: key(), name: '', radiators: [newRadiator(key())] });

type Props = { applianceId: string; today: string; system: HeatingMedium; onSaved: (survey: RadiationSurveyDto) => void; onCancel?: () => void };

export function SurveyForm({ applianceId, today, system, onSaved, onCancel }: Props) {
  const [draft, setDraft] = useState<SurveyDraft>(() => ({ surveyedOn: today, system, designWaterF: system === 'hot_water' ? '170' : '', notes: '', rooms: [room()] }));
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const create = useCreateSurvey(applianceId);

  const setRoom = (i: number, next: RoomDraft) => setDraft({ ...draft, rooms: draft.rooms.map((r, j) => (j === i ? next : r)) });
  const total = runningTotalEdrSqFt(draft.rooms.map((r) => ({ radiators: r.radiators.map(radiatorInputOf) })));

  async function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = radiationSurveyInput.safeParse(surveyInputOf(draft));
    if (!parsed.success) {
      const found: Record<string, string[]> = {};
      for (const issue of parsed.error.issues) (found[issue.path.join('.')] ??= []).push(issue.message);
      setErrors(found);
      return;
    }
    setErrors({});
    try {
      onSaved(await create.mutateAsync(surveyInputOf(draft)));
    } catch (err) {
      if (err instanceof ApiError && err.details) setErrors(err.details);
      else throw err;
    }
  }

  const formError = errors.rooms ?? errors._;
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-label="Radiation survey">
      <div className="grid grid-cols-2 gap-2">
        <TextField label="Surveyed on" type="date" value={draft.surveyedOn} onChange={(e) => setDraft({ ...draft, surveyedOn: e.target.value })} error={errors.surveyedOn} />
        <SelectField label="System" value={draft.system} onChange={(e) => setDraft({ ...draft, system: e.target.value as HeatingMedium })} error={errors.system}>
          {HEATING_MEDIA.map((m) => (
            <option key={m} value={m}>
              {HEATING_MEDIUM_LABELS[m]}
            </option>
          ))}
        </SelectField>
        {draft.system === 'hot_water' && (
          <div className="col-span-2">
            <TextField
              label="Design water temperature (°F, average)"
              hint="The average water temperature on the coldest day; radiator ratings are read at it"
              inputMode="numeric"
              pattern="[0-9]*"
              value={draft.designWaterF}
              onChange={(e) => setDraft({ ...draft, designWaterF: e.target.value })}
              error={errors.designWaterF}
            />
          </div>
        )}
      </div>
      {draft.rooms.map((r, i) => {
        const roomEdr = runningTotalEdrSqFt([{ radiators: r.radiators.map(radiatorInputOf) }]);
        return (
          <section key={r.key} className="flex flex-col gap-2 rounded-plate border-2 border-plate-line bg-plate-deep p-2" aria-label={`Room ${i + 1}`}>
            <TextField label={`Room ${i + 1}`} placeholder="Front room" value={r.name} onChange={(e) => setRoom(i, { ...r, name: e.target.value })} error={errors[`rooms.${i}.name`]} />
            {r.radiators.map((d, j) => (
              <RadiatorFields
                key={d.key}
                draft={d}
                label={`Radiator ${j + 1}`}
                lineEdr={radiatorLineEdrSqFt(radiatorInputOf(d))}
                errors={(field) => errors[`rooms.${i}.radiators.${j}.${field}`]}
                onChange={(next) => setRoom(i, { ...r, radiators: r.radiators.map((x, k) => (k === j ? next : x)) })}
                onRemove={() => setRoom(i, { ...r, radiators: r.radiators.filter((_, k) => k !== j) })}
              />
            ))}
            {errors[`rooms.${i}.radiators`] && <p className="text-sm font-semibold text-due">⚠ {errors[`rooms.${i}.radiators`]![0]}</p>}
            <div className="flex flex-wrap items-center justify-between gap-2">
              <Button variant="secondary" className="min-h-tap" onClick={() => setRoom(i, { ...r, radiators: [...r.radiators, newRadiator(key())] })}>
                Add a radiator to this room
              </Button>
              <span className="tabular font-semibold" data-testid="room-edr">
                Room: {formatEdr(roomEdr)}
              </span>
            </div>
            {draft.rooms.length > 1 && (
              <Button variant="ghost" className="min-h-tap self-start" onClick={() => setDraft({ ...draft, rooms: draft.rooms.filter((_, k) => k !== i) })}>
                Remove this room
              </Button>
            )}
          </section>
        );
      })}
      <Button variant="secondary" className="min-h-tap" onClick={() => setDraft({ ...draft, rooms: [...draft.rooms, room()] })}>
        Add a room
      </Button>
      <TextAreaField label="Notes" value={draft.notes} onChange={(e) => setDraft({ ...draft, notes: e.target.value })} error={errors.notes} />
      {formError && <Notice kind="caution" title={formError[0]!}>Check the rooms above.</Notice>}
      {/* Sticky, so the running total stays in view under the thumb while the list grows. */}
      <div className="sticky bottom-0 flex items-center justify-between gap-2 border-t-2 border-plate-line bg-plate py-2">
        <p className="tabular text-lg font-bold" aria-live="polite" data-testid="running-total">
          Total: {formatEdr(total)} EDR
        </p>
        <div className="flex gap-2">
          {onCancel && (
            <Button variant="ghost" className="min-h-tap" onClick={onCancel}>
              Cancel
            </Button>
          )}
          <Button type="submit" className="min-h-tap" disabled={create.isPending}>
            {create.isPending ? 'Saving…' : 'Save survey'}
          </Button>
        </div>
      </div>
    </form>
  );
}

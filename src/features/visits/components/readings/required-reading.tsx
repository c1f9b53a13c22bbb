import type { ReadingKey } from '@shared/schemas/visits';
import { READING_LABELS } from '@shared/visits/reading-labels';
import { TextInput } from '../inputs';
import { useDraft } from '../draft-context';

/**
 * Beside a reading the template requires: a note that it is required, and a way to record that it could not be
 * taken today and why (an analyzer in repair, no access to the meter). The reason stays with the visit.
 */
export function RequiredReading({ readingKey }: { readingKey: ReadingKey }) {
  const { fields, edit, errors } = useDraft();
  const skips = fields.readingSkips ?? {};
  const reason = skips[readingKey];
  const label = READING_LABELS[readingKey].toLowerCase();
  const setSkip = (next: string | undefined) =>
    edit((f) => {
      const rest = { ...(f.readingSkips ?? {}) };
      if (next === undefined) delete rest[readingKey];
      else rest[readingKey] = next;
      return { ...f, readingSkips: rest };
    });

  if (reason === undefined) {
    return (
      <div className="flex flex-wrap items-center gap-x-3 text-sm">
        <span className="font-semibold">Required on this visit.</span>
        <button type="button" className="min-h-tap font-semibold underline" onClick={() => setSkip('')}>
          Could not take it? Say why
        </button>
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-1 rounded-plate border-2 border-dashed border-plate-line p-2">
      <TextInput
        label={`Why the ${label} was not taken`}
        value={reason}
        onChange={(v) => setSkip(v)}
        maxLength={500}
        placeholder="e.g. analyzer away for calibration"
        field={`readingSkips.${readingKey}`}
        error={errors[`readingSkips.${readingKey}`]}
      />
      <button type="button" className="min-h-tap self-start text-sm font-semibold underline" onClick={() => setSkip(undefined)}>
        Take the {label} after all
      </button>
    </div>
  );
}

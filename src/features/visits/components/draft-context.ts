import { createContext, useContext } from 'react';
import type { ApplianceDto } from '@shared/schemas/records';
import type { DraftFields, FieldErrors, LocalReadings, ReadingKey } from '../draft/draft-fields';
import type { ReadingResults } from '@shared/visits/visit-results';
import type { UnitPrefs } from '../lib/unit-prefs';

export type DraftEditor = {
  visitId: string;
  fields: DraftFields;
  edit: (change: (f: DraftFields) => DraftFields) => void;
  /** Local range errors merged with the server's last refusal, keyed "readings.combustion.o2Pct" etc. */
  errors: FieldErrors;
  appliance: ApplianceDto | undefined;
  /** The site's elevation, ft (null: not recorded), for the altitude derate and its explanation. */
  elevationFt: number | null;
  prefs: UnitPrefs;
  live: ReadingResults;
  /** Readings the template requires on this visit (each taken, or skipped with a reason). */
  requiredReadings: readonly string[];
  /** A number field holding text that is not a number says so here, so completing can refuse it (null: fixed). */
  reportBadText: (path: string, text: string | null) => void;
  /** "Complete visit" was pressed with things missing: unmarked steps are marked on the list too. */
  completionTried: boolean;
};

export const DraftContext = createContext<DraftEditor | null>(null);

export function useDraft(): DraftEditor {
  const ctx = useContext(DraftContext);
  if (!ctx) throw new Error('useDraft outside a visit draft');
  return ctx;
}

/** Sets fields inside one reading block (combustion, gasInput…), or a plain reading when `patch` is not an object. */
export function useReading<K extends ReadingKey>(key: K) {
  const { fields, edit, errors, reportBadText } = useDraft();
  const value = fields.readings[key] as LocalReadings[K];
  const set = (patch: Partial<NonNullable<LocalReadings[K]>> | LocalReadings[K]) =>
    edit((f) => {
      const prev = f.readings[key];
      const next =
        patch !== null && typeof patch === 'object' ? { ...(prev && typeof prev === 'object' ? prev : {}), ...patch } : patch;
      return { ...f, readings: { ...f.readings, [key]: next } };
    });
  const errorFor = (field?: string) => errors[field ? `readings.${key}.${field}` : `readings.${key}`];
  /** The props a NumberField needs to show its errors, be jumped to and report unreadable text. */
  const field = (name?: string) => {
    const path = name ? `readings.${key}.${name}` : `readings.${key}`;
    return { path, error: errors[path], onBadText: (text: string | null) => reportBadText(path, text) };
  };
  return { value, set, errorFor, field };
}

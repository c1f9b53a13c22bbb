import { applianceInput } from '@shared/schemas/records';
import type { ApplianceKind, Construction, Fuel, IgnitionType, VentType } from '@shared/schemas/enums';
import type { CatalogEntryDto } from '@shared/schemas/records';
import type { FieldErrors } from '@/lib/api-client';
import type { ApplianceBody } from '../api/create-appliance';
import { formSpecFields } from './catalog-spec-fields';
import { blankToNull, zodFieldErrors } from '@/lib/form-errors';

/** Everything as typed (strings), so a bad value is kept on screen next to its message. */
export type ApplianceDraft = {
  kind: ApplianceKind | '';
  fuel: Fuel | '';
  construction: Construction | '';
  manufacturer: string;
  model: string;
  serial: string;
  inputBtuh: string;
  firingRateGph: string;
  grossOutputBtuh: string;
  mawpPsi: string;
  manufacturedMonth: string;
  manufacturedYear: string;
  installedOn: string;
  location: string;
  ignitionType: IgnitionType | '';
  burnerCount: string;
  ventType: VentType | '';
};

export type ComponentDraft = {
  rowId: number;
  typeCode: string;
  spec: Record<string, string>;
  installedOn: string;
  originalWithAppliance: boolean;
  note: string;
  /** Added by the starter set and not touched since, so a change of kind or fuel may swap it for a better guess. */
  untouchedSuggestion: boolean;
};

export const emptyApplianceDraft = (): ApplianceDraft => ({
  kind: '',
  fuel: '',
  construction: '',
  manufacturer: '',
  model: '',
  serial: '',
  inputBtuh: '',
  firingRateGph: '',
  grossOutputBtuh: '',
  mawpPsi: '',
  manufacturedMonth: '',
  manufacturedYear: '',
  installedOn: '',
  location: '',
  ignitionType: '',
  burnerCount: '',
  ventType: '',
});

let nextRowId = 1;
export const newComponentDraft = (typeCode = '', suggested = false): ComponentDraft => ({
  rowId: nextRowId++,
  typeCode,
  spec: {},
  installedOn: '',
  originalWithAppliance: suggested,
  note: '',
  untouchedSuggestion: suggested,
});

export const isOil = (d: ApplianceDraft) => d.fuel === 'oil_no2';

/**
 * Builds the request body and checks it with the shared zod schema. Spec numbers are checked here too, since the
 * contract only says "string or number" and the catalog decides which keys are numbers.
 */
export function buildApplianceBody(
  siteId: string,
  draft: ApplianceDraft,
  rows: ComponentDraft[],
  catalog: CatalogEntryDto[],
): { ok: true; body: ApplianceBody } | { ok: false; errors: FieldErrors } {
  const specErrors: FieldErrors = {};
  const components = rows.map((row, i) => {
    const fields = formSpecFields(catalog.find((c) => c.code === row.typeCode));
    const spec: Record<string, string | number> = {};
    for (const field of fields) {
      const raw = (row.spec[field.key] ?? '').trim();
      if (!raw) continue;
      if (field.kind === 'number') {
        const n = Number(raw);
        if (!Number.isFinite(n) || n <= 0) specErrors[`components.${i}.spec.${field.key}`] = [`Give the ${field.label} as a number above 0.`];
        else spec[field.key] = n;
      } else spec[field.key] = raw;
    }
    return {
      typeCode: row.typeCode,
      spec,
      installedOn: row.originalWithAppliance ? null : blankToNull(row.installedOn),
      originalWithAppliance: row.originalWithAppliance,
      note: row.note,
    };
  });

  const oil = isOil(draft);
  const parsed = applianceInput.safeParse({
    siteId,
    kind: draft.kind || undefined,
    fuel: draft.fuel || undefined,
    construction: draft.construction || undefined,
    manufacturer: draft.manufacturer,
    model: draft.model,
    serial: draft.serial,
    inputBtuh: oil ? null : blankToNull(draft.inputBtuh),
    firingRateGph: oil ? blankToNull(draft.firingRateGph) : null,
    grossOutputBtuh: blankToNull(draft.grossOutputBtuh),
    mawpPsi: blankToNull(draft.mawpPsi),
    manufacturedMonth: blankToNull(draft.manufacturedMonth),
    manufacturedYear: blankToNull(draft.manufacturedYear),
    installedOn: blankToNull(draft.installedOn),
    location: draft.location,
    ignitionType: draft.ignitionType || undefined,
    burnerCount: blankToNull(draft.burnerCount),
    ventType: draft.ventType || undefined,
    components,
  });
  const errors = { ...(parsed.success ? {} : zodFieldErrors(parsed.error)), ...specErrors };
  if (!parsed.success || Object.keys(errors).length) return { ok: false, errors };
  return { ok: true, body: parsed.data };
}

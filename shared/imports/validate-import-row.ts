import { z } from 'zod';
import { isStorableText, UNSTORABLE_TEXT_MESSAGE } from '../schemas/common';
import { SITE_ELEVATION_RANGE_FT } from '../schemas/records';
import type { ApplianceKind, Construction, Fuel, IgnitionType, VentType, VisitOutcome, VisitType } from '../schemas/enums';
import type { ComponentType } from '../trade/component-types';
import { applianceKindChoice, constructionChoice, fuelChoice, ignitionChoice, ventChoice, visitOutcomeChoice, visitTypeChoice } from './import-choices';
import { IMPORT_FIELDS, PART_SLOTS, VISIT_SLOTS, type ImportField } from './import-fields';
import { IMPORT_DATE_FORMATS_HINT, parseImportDate } from './parse-import-date';
import { parseSpecText } from './parse-spec-text';
import { RECORD_WORDS } from '../glossary/words';

export type ImportRowError = { row: number; field: ImportField; column: string; value: string; message: string };

export type ImportRow = {
  /** The spreadsheet's row number: the header is row 1. */
  row: number;
  customer: { externalId: string | null; name: string; phone: string | null; email: string | null };
  site: { street: string; town: string; postalCode: string | null; accessNotes: string | null; elevationFt: number | null };
  appliance: {
    externalId: string | null;
    kind: ApplianceKind;
    fuel: Fuel;
    construction: Construction;
    ignitionType: IgnitionType;
    ventType: VentType;
    /** Fields the file did not give, filled with the usual arrangement for the kind and fuel; said on the record. */
    assumed: string[];
    manufacturer: string | null;
    model: string | null;
    serial: string | null;
    inputBtuh: number | null;
    installedOn: string | null;
    location: string | null;
  };
  parts: { typeCode: ComponentType; spec: Record<string, string | number>; description: string | null; installedOn: string | null }[];
  visits: { visitedOn: string; type: VisitType; outcome: VisitOutcome | null; notes: string }[];
};

export type RowContext = {
  row: number;
  /** Field → the cell's text (already read through the mapping). */
  cells: Partial<Record<ImportField, string>>;
  /** Field → header, for messages. */
  columns: Partial<Record<ImportField, string>>;
  /** The company's date: nothing imported may have happened after it. */
  today: string;
  /** The company's part types, by code and by normalised label. */
  partType: (text: string) => ComponentType | null;
};

const LIMITS: Partial<Record<ImportField, number>> = {
  customerExternalId: 80,
  customerName: 160,
  customerPhone: 40,
  customerEmail: 254,
  siteStreet: 200,
  siteTown: 120,
  sitePostalCode: 20,
  siteAccessNotes: 2000,
  applianceExternalId: 80,
  manufacturer: 120,
  model: 120,
  serial: 80,
  location: 200,
};
const emailSchema = z.email();

const fmtFeet = (n: number) => n.toLocaleString('en-US').replace('-', '−');

/** "5,280", "5280 ft", "-20 feet" → feet; the same whole-foot range as the site form (sites.elevation_ft). */
function siteElevationFt(value: string | null, fail: (message: string) => void): number | null {
  if (value === null) return null;
  const n = Number(value.replace(/[,\s]/g, '').replace(/(ft|feet|')$/i, '').replace('−', '-'));
  const { min, max } = SITE_ELEVATION_RANGE_FT;
  if (!Number.isInteger(n) || n < min || n > max) {
    fail(`'${value}' is not a site elevation in feet (a whole number from ${fmtFeet(min)} to ${fmtFeet(max)}, as on the site form).`);
    return null;
  }
  return n;
}

/** One row of the file → what would be stored, or every error of the row at once. */
export function validateImportRow(ctx: RowContext): { value: ImportRow | null; errors: ImportRowError[] } {
  const errors: ImportRowError[] = [];
  const fail = (field: ImportField, message: string) =>
    errors.push({ row: ctx.row, field, column: ctx.columns[field] ?? IMPORT_FIELDS[field].label, value: ctx.cells[field] ?? '', message });
  const text = (field: ImportField): string | null => {
    const value = (ctx.cells[field] ?? '').trim();
    if (!value) return null;
    if (!isStorableText(value)) return fail(field, UNSTORABLE_TEXT_MESSAGE), null;
    const max = LIMITS[field] ?? 4000;
    if (value.length > max) return fail(field, `is ${value.length} characters long; at most ${max}.`), null;
    return value;
  };
  const required = (field: ImportField) => {
    const value = text(field);
    if (value === null && !errors.some((e) => e.field === field)) fail(field, 'is empty; every row needs it.');
    return value;
  };
  const date = (field: ImportField) => {
    const value = text(field);
    if (value === null) return null;
    const iso = parseImportDate(value);
    if (!iso) return fail(field, `'${value}' is not a date; ${IMPORT_DATE_FORMATS_HINT}.`), null;
    if (iso > ctx.today) return fail(field, `'${value}' is in the future.`), null;
    return iso;
  };
  const choice = <T extends string>(field: ImportField, m: { match: (t: string) => T | null; hint: string }, need: boolean): T | null => {
    const value = need ? required(field) : text(field);
    if (value === null) return null;
    const code = m.match(value);
    if (!code) fail(field, `'${value}' is not one we know; use one of: ${m.hint}.`);
    return code;
  };

  const name = required('customerName');
  const email = text('customerEmail');
  if (email && !emailSchema.safeParse(email.toLowerCase()).success) fail('customerEmail', `'${email}' is not an e-mail address.`);
  const street = required('siteStreet');
  const town = required('siteTown');
  const kind = choice('applianceKind', applianceKindChoice, true);
  const fuel = choice('fuel', fuelChoice, true);
  const construction = choice('construction', constructionChoice, false);
  const ignitionType = choice('ignitionType', ignitionChoice, false);
  const ventType = choice('ventType', ventChoice, false);
  const inputText = text('inputBtuh');
  let inputBtuh: number | null = null;
  if (inputText !== null) {
    const n = Number(inputText.replace(/[,\s]/g, '').replace(/btu\/?h?$/i, ''));
    if (!Number.isInteger(n) || n < 1000 || n > 20_000_000) fail('inputBtuh', `'${inputText}' is not an input rating in Btu/h (a whole number from 1,000 to 20,000,000).`);
    else inputBtuh = n;
  }
  const installedOn = date('installedOn');

  const parts: ImportRow['parts'] = [];
  for (const n of PART_SLOTS) {
    const typeField = `part${n}Type` as ImportField;
    const typeText = text(typeField);
    const specText = text(`part${n}Spec` as ImportField);
    const partDate = date(`part${n}InstalledOn` as ImportField);
    if (typeText === null) {
      if (specText !== null || partDate !== null) fail(typeField, 'is empty, but the part has a spec or a date: name the part type.');
      continue;
    }
    const typeCode = ctx.partType(typeText);
    if (!typeCode) {
      fail(typeField, `'${typeText}' is not one of your part types (see ${RECORD_WORDS.catalogPage}).`);
      continue;
    }
    const spec = specText === null ? {} : parseSpecText(typeCode, specText);
    parts.push({ typeCode, spec: spec ?? {}, description: spec === null ? specText : null, installedOn: partDate ?? installedOn });
  }

  const visits: ImportRow['visits'] = [];
  for (const n of VISIT_SLOTS) {
    const dateField = `visit${n}Date` as ImportField;
    const visitedOn = date(dateField);
    const type = choice(`visit${n}Type` as ImportField, visitTypeChoice, false);
    const outcome = choice(`visit${n}Outcome` as ImportField, visitOutcomeChoice, false);
    const notes = text(`visit${n}Notes` as ImportField);
    if (visitedOn === null) {
      if ((type !== null || outcome !== null || notes !== null) && !errors.some((e) => e.field === dateField)) fail(dateField, 'is empty, but the visit has other details: give its date.');
      continue;
    }
    visits.push({ visitedOn, type: type ?? 'annual_maintenance', outcome, notes: notes ?? '' });
  }

  const externalId = text('customerExternalId');
  const applianceExternalId = text('applianceExternalId');
  const phone = text('customerPhone');
  const postalCode = text('sitePostalCode');
  const accessNotes = text('siteAccessNotes');
  const elevationFt = siteElevationFt(text('siteElevationFt'), (message) => fail('siteElevationFt', message));
  const manufacturer = text('manufacturer');
  const model = text('model');
  const serial = text('serial');
  const location = text('location');
  if (errors.length || !name || !street || !town || !kind || !fuel) return { value: null, errors };

  const assumed: string[] = [];
  const oil = fuel === 'oil_no2';
  if (!construction) assumed.push('construction');
  if (!ignitionType) assumed.push('ignition');
  if (!ventType) assumed.push('vent');
  return {
    value: {
      row: ctx.row,
      customer: { externalId, name, phone, email: email?.toLowerCase() ?? null },
      site: { street, town, postalCode, accessNotes, elevationFt },
      appliance: {
        externalId: applianceExternalId,
        kind,
        fuel,
        construction: construction ?? (kind === 'water_heater' || kind === 'furnace' ? 'steel_fire_tube' : 'cast_iron'),
        // Often not columns of an old list: the usual arrangement for the fuel, and the record says it was assumed,
        // for the technician to confirm on the first visit (the checklist and the draft checks depend on them).
        ignitionType: ignitionType ?? (oil ? 'oil_burner' : 'standing_pilot'),
        ventType: ventType ?? (oil ? 'barometric_damper' : 'draft_hood'),
        assumed,
        manufacturer,
        model,
        serial,
        inputBtuh,
        installedOn,
        location,
      },
      parts,
      visits,
    },
    errors,
  };
}

/**
 * The columns an import file may carry, one row per appliance. Customer and site columns repeat on every row of
 * the same customer or site; they are merged by the external id when the file has one, else by the normalised name
 * and address.
 */
export const PART_SLOTS = [1, 2, 3] as const;
export const VISIT_SLOTS = [1, 2, 3] as const;

type FieldDef = { label: string; required?: boolean; synonyms: readonly string[] };

const partFields = (n: number) =>
  ({
    [`part${n}Type`]: { label: `Part ${n}: type`, synonyms: [`part ${n}`, `part ${n} type`, `component ${n}`, `component ${n} type`] },
    [`part${n}Spec`]: { label: `Part ${n}: size or spec`, synonyms: [`part ${n} spec`, `part ${n} size`, `component ${n} spec`] },
    [`part${n}InstalledOn`]: { label: `Part ${n}: installed on`, synonyms: [`part ${n} installed`, `part ${n} installed on`, `part ${n} date`] },
  }) as Record<string, FieldDef>;
const visitFields = (n: number) =>
  ({
    [`visit${n}Date`]: { label: `Visit ${n}: date`, synonyms: [`visit ${n}`, `visit ${n} date`, `service ${n} date`, `last service`].slice(0, n === 1 ? 4 : 3) },
    [`visit${n}Type`]: { label: `Visit ${n}: type`, synonyms: [`visit ${n} type`, `service ${n} type`] },
    [`visit${n}Outcome`]: { label: `Visit ${n}: outcome`, synonyms: [`visit ${n} outcome`, `visit ${n} result`] },
    [`visit${n}Notes`]: { label: `Visit ${n}: notes`, synonyms: [`visit ${n} notes`, `visit ${n} findings`, `service ${n} notes`] },
  }) as Record<string, FieldDef>;

export const IMPORT_FIELDS = {
  customerExternalId: { label: 'Customer id (from your old system)', synonyms: ['customer id', 'customer no', 'customer number', 'account', 'account no', 'account number', 'cust id'] },
  customerName: { label: 'Customer name', required: true, synonyms: ['customer', 'name', 'customer name', 'client', 'client name', 'full name'] },
  customerPhone: { label: 'Customer phone', synonyms: ['phone', 'telephone', 'tel', 'phone number', 'mobile', 'cell'] },
  customerEmail: { label: 'Customer e-mail', synonyms: ['email', 'e-mail', 'email address', 'e-mail address', 'mail'] },
  siteStreet: { label: 'Street address', required: true, synonyms: ['street', 'address', 'street address', 'address 1', 'address line 1', 'site address', 'service address'] },
  siteTown: { label: 'Town', required: true, synonyms: ['town', 'city', 'municipality', 'locality'] },
  sitePostalCode: { label: 'Postal code', synonyms: ['zip', 'zip code', 'postcode', 'postal code', 'post code'] },
  siteElevationFt: {
    label: 'Site elevation (ft)',
    synonyms: ['elevation', 'elevation ft', 'elevation feet', 'site elevation', 'altitude', 'altitude ft', 'altitude feet', 'feet above sea level'],
  },
  siteAccessNotes: { label: 'Access notes', synonyms: ['access', 'access notes', 'directions', 'key', 'entry notes'] },
  applianceExternalId: { label: 'Appliance id (from your old system)', synonyms: ['appliance id', 'equipment id', 'unit id', 'boiler id', 'asset id'] },
  applianceKind: { label: 'Kind of appliance', required: true, synonyms: ['kind', 'type', 'appliance', 'appliance type', 'equipment', 'equipment type', 'unit type'] },
  fuel: { label: 'Fuel', required: true, synonyms: ['fuel', 'fuel type', 'energy'] },
  construction: { label: 'Construction', synonyms: ['construction', 'material', 'heat exchanger'] },
  ignitionType: { label: 'Ignition', synonyms: ['ignition', 'ignition type', 'pilot', 'pilot type'] },
  ventType: { label: 'Venting', synonyms: ['vent', 'venting', 'vent type', 'draft', 'flue type'] },
  manufacturer: { label: 'Make', synonyms: ['make', 'manufacturer', 'brand', 'mfr'] },
  model: { label: 'Model', synonyms: ['model', 'model number', 'model no'] },
  serial: { label: 'Serial number', synonyms: ['serial', 'serial number', 'serial no', 's/n', 'sn'] },
  inputBtuh: { label: 'Input rating (Btu/h)', synonyms: ['input', 'btu', 'btuh', 'btu/h', 'input btuh', 'input rating', 'rating'] },
  installedOn: { label: 'Installed on', synonyms: ['installed', 'install date', 'installed on', 'installation date', 'date installed'] },
  location: { label: 'Where it is', synonyms: ['location', 'room', 'where'] },
  ...partFields(1),
  ...partFields(2),
  ...partFields(3),
  ...visitFields(1),
  ...visitFields(2),
  ...visitFields(3),
} satisfies Record<string, FieldDef>;

export type ImportField = keyof typeof IMPORT_FIELDS;
export const IMPORT_FIELD_KEYS = Object.keys(IMPORT_FIELDS) as ImportField[];
export const REQUIRED_IMPORT_FIELDS = IMPORT_FIELD_KEYS.filter((k) => (IMPORT_FIELDS[k] as FieldDef).required);
export const importFieldLabel = (field: ImportField) => IMPORT_FIELDS[field].label;

/** Field → the header of the column it is read from. */
export type ImportMapping = Partial<Record<ImportField, string>>;

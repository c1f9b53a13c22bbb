import { randomUUID } from 'node:crypto';
import type { ImportCounts, ImportPreviewRow } from '../../../shared/schemas/imports';
import { LABELS } from '../../../shared/schemas/enums';
import { formatCalendarDate } from '../../../shared/format/dates';
import { IMPORT_FIELD_KEYS, REQUIRED_IMPORT_FIELDS, type ImportField, type ImportMapping } from '../../../shared/imports/import-fields';
import { validateImportRow, type ImportRow, type ImportRowError } from '../../../shared/imports/validate-import-row';
import { COMPONENT_TYPES, formatSpec, type ComponentType } from '../../../shared/trade/component-types';
import { addressKey, nameKey, serialKey } from './match-keys';

/** What one row of the file does: which records it creates, which it only fills in, which it finds already there. */
export type RowPlan = {
  row: ImportRow;
  /** insert: this row is the first to name a new record, so it writes it; fill: details an existing customer lacked. */
  customer: { id: string; insert: boolean; fill: { phone?: string; email?: string } };
  site: { id: string; insert: boolean };
  appliance: { id: string; insert: boolean };
  parts: (ImportRow['parts'][number] & { id: string; specKey: string })[];
  visits: (ImportRow['visits'][number] & { id: string })[];
};

/** The company's records by the keys an import matches on. */
export type ExistingRecords = {
  customers: Map<string, { id: string; phone: string | null; email: string | null }>;
  sites: Map<string, string>;
  appliances: Map<string, string>;
};

type Fate = 'create' | 'update' | 'skip';

export type ImportPlan = {
  rows: RowPlan[];
  errors: ImportRowError[];
  errorRowNumbers: Set<number>;
  counts: ImportCounts;
  missingRequired: ImportField[];
  /** Appliances the file names that the company already has: their parts and visits are checked for repeats. */
  existingApplianceIds: string[];
};

const emptyCounts = (): ImportCounts => ({
  customers: { create: 0, update: 0, skip: 0 },
  sites: { create: 0, update: 0, skip: 0 },
  appliances: { create: 0, update: 0, skip: 0 },
  parts: { create: 0, update: 0, skip: 0 },
  visits: { create: 0, update: 0, skip: 0 },
});

/**
 * Reads every row through the mapping and matches it against what the company already has, so a dry run and the
 * import itself decide the same things, and a second run of the same file finds everything already there.
 * Records are matched by the old system's id when the file has one, else by the customer's name, the site's
 * address (in that customer), and the appliance's serial number (or, without one, its kind and fuel at that site).
 */
export function planImport(input: {
  headers: string[];
  rows: string[][];
  mapping: ImportMapping;
  today: string;
  partTypes: Map<string, ComponentType>;
  existing: ExistingRecords;
}): ImportPlan {
  const column = new Map(input.headers.map((h, i) => [h, i]));
  const mapped = IMPORT_FIELD_KEYS.filter((f) => input.mapping[f] && column.has(input.mapping[f]!));
  const missingRequired = REQUIRED_IMPORT_FIELDS.filter((f) => !mapped.includes(f));
  const counts = emptyCounts();
  const errors: ImportRowError[] = [];
  const errorRowNumbers = new Set<number>();
  const rows: RowPlan[] = [];
  if (missingRequired.length) return { rows, errors, errorRowNumbers, counts, missingRequired, existingApplianceIds: [] };

  const { existing } = input;
  // What happens to each distinct record over the whole file: counted once, however many rows name it.
  const customerFate = new Map<string, Fate>();
  const siteFate = new Map<string, Fate>();
  const applianceFate = new Map<string, Fate>();
  const partType = (text: string) => input.partTypes.get(nameKey(text)) ?? null;

  input.rows.forEach((cells, i) => {
    const rowNumber = i + 2;
    const byField: Partial<Record<ImportField, string>> = {};
    for (const f of mapped) byField[f] = cells[column.get(input.mapping[f]!)!] ?? '';
    const { value, errors: rowErrors } = validateImportRow({ row: rowNumber, cells: byField, columns: input.mapping, today: input.today, partType });
    if (!value) {
      errors.push(...rowErrors);
      errorRowNumbers.add(rowNumber);
      return;
    }

    const customerKey = value.customer.externalId ? `x:${value.customer.externalId}` : `n:${nameKey(value.customer.name)}`;
    let customer = existing.customers.get(customerKey);
    const fill: RowPlan['customer']['fill'] = {};
    let insertCustomer = false;
    if (!customer) {
      customer = { id: randomUUID(), phone: value.customer.phone, email: value.customer.email };
      existing.customers.set(customerKey, customer);
      // Also under the name, so a later row without the old system's id still finds the same customer.
      existing.customers.set(`n:${nameKey(value.customer.name)}`, customer);
      insertCustomer = true;
      customerFate.set(customer.id, 'create');
    } else {
      if (!customer.phone && value.customer.phone) fill.phone = customer.phone = value.customer.phone;
      if (!customer.email && value.customer.email) fill.email = customer.email = value.customer.email;
      const fate = customerFate.get(customer.id);
      if (fate !== 'create') customerFate.set(customer.id, Object.keys(fill).length || fate === 'update' ? 'update' : 'skip');
    }

    const siteKey = `${customer.id}|${addressKey(value.site.street)}|${addressKey(value.site.town)}`;
    let siteId = existing.sites.get(siteKey);
    const insertSite = !siteId;
    if (!siteId) {
      siteId = randomUUID();
      existing.sites.set(siteKey, siteId);
      siteFate.set(siteId, 'create');
    } else if (!siteFate.has(siteId)) siteFate.set(siteId, 'skip');

    const a = value.appliance;
    const applianceKey = a.externalId ? `x:${a.externalId}` : a.serial ? `${siteId}|s:${serialKey(a.serial)}` : `${siteId}|k:${a.kind}|${a.fuel}`;
    let applianceId = existing.appliances.get(applianceKey);
    const insertAppliance = !applianceId;
    if (!applianceId) {
      applianceId = randomUUID();
      existing.appliances.set(applianceKey, applianceId);
      applianceFate.set(applianceId, 'create');
    } else if (!applianceFate.has(applianceId)) applianceFate.set(applianceId, 'skip');

    const parts: RowPlan['parts'] = value.parts.map((p) => ({ ...p, id: randomUUID(), specKey: formatSpec(p.typeCode, p.spec) }));
    const visits: RowPlan['visits'] = value.visits.map((v) => ({ ...v, id: randomUUID() }));
    rows.push({ row: value, customer: { id: customer.id, insert: insertCustomer, fill }, site: { id: siteId, insert: insertSite }, appliance: { id: applianceId, insert: insertAppliance }, parts, visits });
  });
  for (const fate of customerFate.values()) counts.customers[fate]++;
  for (const fate of siteFate.values()) counts.sites[fate]++;
  for (const fate of applianceFate.values()) counts.appliances[fate]++;
  const existingApplianceIds = [...applianceFate].filter(([, fate]) => fate === 'skip').map(([id]) => id);
  return { rows, errors, errorRowNumbers, counts, missingRequired, existingApplianceIds };
}

export type HistoryKeys = { parts: Set<string>; visits: Set<string> };
export const partKey = (applianceId: string, typeCode: string, installedOn: string | null) => `${applianceId}|${typeCode}|${installedOn ?? ''}`;
export const visitKey = (applianceId: string, visitedOn: string, type: string) => `${applianceId}|${visitedOn}|${type}`;

/**
 * Drops the parts and visits the appliances already have (from an earlier run of the file, or typed in by hand:
 * the same part type installed on the same date, the same kind of visit on the same day), and repeats within the
 * file, then counts them.
 */
export function dropKnownHistory(plan: ImportPlan, known: HistoryKeys): ImportPlan {
  const parts = new Set(known.parts);
  const visits = new Set(known.visits);
  for (const r of plan.rows) {
    r.parts = r.parts.filter((p) => {
      const key = partKey(r.appliance.id, p.typeCode, p.installedOn);
      const fresh = !parts.has(key);
      parts.add(key);
      plan.counts.parts[fresh ? 'create' : 'skip']++;
      return fresh;
    });
    r.visits = r.visits.filter((v) => {
      const key = visitKey(r.appliance.id, v.visitedOn, v.type);
      const fresh = !visits.has(key);
      visits.add(key);
      plan.counts.visits[fresh ? 'create' : 'skip']++;
      return fresh;
    });
  }
  return plan;
}

/** The first rows as they will be stored, in words. */
export function previewRows(plan: ImportPlan, limit = 20): ImportPreviewRow[] {
  const word = (insert: boolean, filled = false) => (insert ? 'new' : filled ? 'found; details added' : 'already there');
  return plan.rows.slice(0, limit).map(({ row, customer, site, appliance, parts, visits }) => ({
    row: row.row,
    customer: `${row.customer.name} (${word(customer.insert, Object.keys(customer.fill).length > 0)})`,
    site: `${row.site.street}, ${row.site.town} (${word(site.insert)})`,
    appliance: `${LABELS.applianceKind[row.appliance.kind]}, ${LABELS.fuel[row.appliance.fuel]}${row.appliance.serial ? `, serial ${row.appliance.serial}` : ''} (${word(appliance.insert)})`,
    parts: parts.map((p) => [COMPONENT_TYPES[p.typeCode].label, p.specKey || p.description, p.installedOn ? `installed ${formatCalendarDate(p.installedOn)}` : null].filter(Boolean).join(', ')),
    visits: visits.map((v) => `${formatCalendarDate(v.visitedOn)}: ${LABELS.visitType[v.type]}${v.outcome ? `, ${LABELS.visitOutcome[v.outcome].toLowerCase()}` : ''}`),
  }));
}

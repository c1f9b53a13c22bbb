/**
 * The life-record API contract: zod inputs (validated by the server, reused by the client's forms) and the DTOs
 * the server returns. Routes (all under /api, all tenant-filtered):
 *
 *   GET    /search?q=                       SearchHit[]            records:read   (name, street, phone or serial; as you type)
 *   GET    /customers?q=&sort=&after=&limit= Page<CustomerListItem> records:read   (keyset paging; sort 'name' | 'town' | 'created')
 *   POST   /customers                       CustomerDto            records:write
 *   GET    /customers/:id                   CustomerDetailDto      records:read
 *   PATCH  /customers/:id                   CustomerDto            records:write
 *   POST   /sites                           SiteDto                records:write
 *   PATCH  /sites/:id                       SiteDto                records:write
 *   POST   /appliances                      ApplianceRecordDto     records:write  (appliance with its components in one request)
 *   GET    /appliances/:id                  ApplianceRecordDto     records:read
 *   PATCH  /appliances/:id                  ApplianceRecordDto     records:write
 *   POST   /appliances/:id/replace          ApplianceRecordDto     records:write  (marks removed, links the new one)
 *   POST   /appliances/:id/components       ComponentDto           records:write
 *   GET    /appliances/:id/timeline?kind=&before=&limit=  Page<TimelineEventDto>  records:read (newest first, keyset on (occurredAt, id))
 *   GET    /catalog/component-types         CatalogEntryDto[]      records:read
 *   PATCH  /catalog/component-types/:code   CatalogEntryDto        catalog:manage
 *   GET    /checklist-templates             ChecklistTemplateDto[] records:read
 *   PUT    /checklist-templates/:id         ChecklistTemplateDto   catalog:manage
 *
 * Visits: see shared/schemas/visits.ts.
 */
import type { TransferProvenanceDto } from './record-transfers';
import { z } from 'zod';
import * as E from './enums';
import { isoDate, nonEmptyPatch, optionalText, requiredText, storableText } from './common';
import { READING_KEYS } from './visits';
import type { NextBookingDto } from './bookings';

const optionalInt = (label: string, min: number, max: number) =>
  z.coerce
    .number(`${label} must be a number.`)
    .int(`${label} must be a whole number.`)
    .min(min, `${label} must be at least ${min}.`)
    .max(max, `${label} must be at most ${max}.`)
    .nullish();
const optionalNumber = (label: string, min: number, max: number) =>
  z.coerce.number(`${label} must be a number.`).min(min, `${label} must be at least ${min}.`).max(max, `${label} must be at most ${max}.`).nullish();
const email = storableText()
  .trim()
  .transform((v) => (v === '' ? null : v.toLowerCase()))
  .pipe(z.email('Enter a valid e-mail address.').nullable())
  .nullish();

export const customerInput = z.object({
  name: requiredText('Name', 160),
  kind: z.enum(E.CUSTOMER_KINDS).default('homeowner'),
  phone: optionalText(40),
  email,
  remindersOptOut: z.boolean().default(false),
  notes: optionalText(4000),
});
// Without the defaults, so a partial update never resets a field it did not name.
export const customerPatch = nonEmptyPatch(customerInput.extend({ kind: z.enum(E.CUSTOMER_KINDS), remindersOptOut: z.boolean() }).partial());
export type CustomerInput = z.input<typeof customerInput>;

/** Feet above sea level a site may have: the range of the NFPA 54 derate rule (shared/trade/gas-input.ts). */
export const SITE_ELEVATION_RANGE_FT = { min: -1500, max: 15_000 } as const;

export const siteInput = z.object({
  customerId: z.uuid('Pick a customer.'),
  street: requiredText('Street address', 200),
  town: requiredText('Town', 120),
  postalCode: optionalText(20),
  accessNotes: optionalText(2000),
  /** Feet above sea level, for the NFPA 54 altitude derate; the range of the derate rule (shared/trade/gas-input.ts). */
  elevationFt: optionalInt('Elevation', SITE_ELEVATION_RANGE_FT.min, SITE_ELEVATION_RANGE_FT.max),
  assignedTechnicianId: z.uuid().nullish(),
});
export const sitePatch = nonEmptyPatch(siteInput.omit({ customerId: true }).partial());
export type SiteInput = z.input<typeof siteInput>;

export const componentInput = z
  .object({
    typeCode: requiredText('Part type', 60),
    description: optionalText(200),
    spec: z.record(storableText(), z.union([storableText().max(60), z.number()])).default({}),
    installedOn: isoDate.nullish(),
    originalWithAppliance: z.boolean().default(false),
    note: optionalText(2000),
  })
  .refine((c) => c.originalWithAppliance || c.installedOn, {
    path: ['installedOn'],
    message: 'Give the date it was installed, or mark it original with the appliance.',
  });
export type ComponentInput = z.input<typeof componentInput>;

export const applianceFields = z.object({
  siteId: z.uuid('Pick a site.'),
  kind: z.enum(E.APPLIANCE_KINDS, 'Choose the kind of appliance.'),
  fuel: z.enum(E.FUELS, 'Choose the fuel.'),
  construction: z.enum(E.CONSTRUCTIONS, 'Choose the construction.'),
  manufacturer: optionalText(120),
  model: optionalText(120),
  serial: optionalText(80),
  inputBtuh: optionalInt('Input rating', 1000, 20_000_000),
  firingRateGph: optionalNumber('Firing rate', 0.1, 100),
  grossOutputBtuh: optionalInt('Gross output', 1000, 20_000_000),
  mawpPsi: optionalNumber('Maximum allowable working pressure', 1, 1000),
  manufacturedMonth: optionalInt('Month of manufacture', 1, 12),
  manufacturedYear: optionalInt('Year of manufacture', 1900, 2100),
  installedOn: isoDate.nullish(),
  location: optionalText(200),
  ignitionType: z.enum(E.IGNITION_TYPES, 'Choose the ignition type.'),
  burnerCount: optionalInt('Burner count', 1, 64),
  ventType: z.enum(E.VENT_TYPES, 'Choose the vent type.'),
});
export const applianceInput = applianceFields.extend({ components: z.array(componentInput).max(60).default([]) });
export const appliancePatch = nonEmptyPatch(applianceFields.omit({ siteId: true }).partial().extend({ status: z.enum(E.APPLIANCE_STATUSES).optional() }));
export const replaceApplianceInput = z.object({
  newApplianceId: z.uuid('Pick the appliance that replaced it.'),
  removedOn: isoDate,
  reason: optionalText(500),
});
export type ApplianceInput = z.input<typeof applianceInput>;

export const pageQuery = z.object({
  after: storableText().max(300).optional(),
  limit: z.coerce.number().int().min(1).max(100).default(50),
});
export const customerListQuery = pageQuery.extend({
  q: storableText().trim().max(100).optional(),
  sort: z.enum(['name', 'town', 'created']).default('name'),
});
export const searchQuery = z.object({ q: storableText().trim().min(2, 'Type at least 2 characters.').max(100) });
export const timelineQuery = z.object({
  kind: z.enum(E.TIMELINE_KINDS).optional(),
  before: storableText().max(100).optional(),
  limit: z.coerce.number().int().min(1).max(100).default(50),
});

export type Page<T> = { items: T[]; nextCursor: string | null };

export type CustomerDto = {
  id: string;
  name: string;
  kind: E.CustomerKind;
  phone: string | null;
  email: string | null;
  remindersOptOut: boolean;
  notes: string | null;
};
export type CustomerListItem = CustomerDto & { siteCount: number; applianceCount: number; firstTown: string | null };
export type SiteDto = {
  id: string;
  customerId: string;
  street: string;
  town: string;
  postalCode: string | null;
  accessNotes: string | null;
  elevationFt: number | null;
  assignedTechnicianId: string | null;
  assignedTechnicianName: string | null;
};
export type ApplianceSummary = {
  id: string;
  siteId: string;
  kind: E.ApplianceKind;
  fuel: E.Fuel;
  construction: E.Construction;
  manufacturer: string | null;
  model: string | null;
  serial: string | null;
  status: E.ApplianceStatus;
  installedOn: string | null;
  location: string | null;
};
export type CustomerDetailDto = CustomerDto & { sites: (SiteDto & { appliances: ApplianceSummary[] })[] };

export type ComponentDto = {
  id: string;
  typeCode: string;
  typeLabel: string;
  description: string | null;
  spec: Record<string, string | number>;
  specKey: string;
  installedOn: string | null;
  originalWithAppliance: boolean;
  note: string | null;
  conditionFailed: boolean;
  conditionNote: string | null;
  lastInspectedOn: string | null;
  removedOn: string | null;
  removalReason: string | null;
  replacedById: string | null;
  due: { kind: 'inspection' | 'replacement'; dueOn: string; status: 'ok' | 'due_soon' | 'overdue' | 'replace_now'; reason: string } | null;
};

export type ApplianceDto = ApplianceSummary & {
  inputBtuh: number | null;
  firingRateGph: number | null;
  grossOutputBtuh: number | null;
  mawpPsi: number | null;
  manufacturedMonth: number | null;
  manufacturedYear: number | null;
  ignitionType: E.IgnitionType;
  burnerCount: number | null;
  ventType: E.VentType;
  replacedById: string | null;
  replaces: { id: string; label: string } | null;
};

export type ApplianceRecordDto = {
  appliance: ApplianceDto;
  site: SiteDto;
  customer: CustomerDto;
  /** Age in whole years from the install date (or year of manufacture), in the company's time zone. */
  ageYears: number | null;
  components: ComponentDto[];
  lastVisit: { id: string; visitedOn: string; type: E.VisitType; outcome: E.VisitOutcome | null } | null;
  /** An open draft visit, so a technician can carry on where they stopped. */
  openDraftVisitId: string | null;
  /** The next booked visit; on its day, "Start visit" links the visit to it. */
  nextBooking: NextBookingDto | null;
  /** The latest completed visit ended "shut down as unsafe": shown first on the record. */
  unsafe: { visitId: string; visitedOn: string; reason: string | null } | null;
  /** Filled by the due engine; an empty list (never invented items) until it has run. */
  due: { componentId: string; typeLabel: string; kind: 'inspection' | 'replacement'; dueOn: string; status: string; reason: string }[];
  endOfLife: { medianYears: number | null; status: 'within' | 'near' | 'past' | 'unknown'; source: string } | null;
  /** Set when this record was copied from another company with the homeowner's consent (its history was recorded there). */
  transferredFrom?: TransferProvenanceDto | null;
};

export type TimelineEventDto = {
  id: number;
  occurredAt: string;
  kind: E.TimelineKind;
  summary: string;
  refId: string | null;
  data: Record<string, unknown>;
  actorName: string | null;
};

export type SearchHit = {
  applianceId: string;
  applianceLabel: string;
  customerName: string;
  street: string;
  town: string;
  serial: string | null;
  matched: 'name' | 'street' | 'phone' | 'serial';
};

export type CatalogEntryDto = { code: string; group: string; label: string; specFields: unknown[]; active: boolean };
export const catalogCodeParam = z.object({ code: storableText().regex(/^[a-z0-9_]{1,60}$/, 'Not a valid part type code.') });
export const catalogPatch = nonEmptyPatch(z.object({ label: requiredText('Label', 80).optional(), active: z.boolean().optional() }));

export const checklistItemTemplate = z.object({
  key: storableText().trim().min(1).max(60).regex(/^[a-z0-9_]+$/, 'Use lower-case letters, digits and underscores.'),
  section: requiredText('Section', 60),
  label: requiredText('Item', 400),
  caution: optionalText(500).transform((v) => v ?? undefined),
  readings: z.array(storableText().max(60)).max(20).optional(),
});
/** Per visit type, readings a visit must record or skip with a reason; each must be one an item records. Kept when not sent. */
export const requiredReadingsInput = z.partialRecord(z.enum(E.VISIT_TYPES), z.array(z.enum(READING_KEYS, 'Not a reading of this form.')).max(20));
export const checklistTemplateInput = z.object({
  name: requiredText('Name', 120),
  items: z.array(checklistItemTemplate).min(1, 'A checklist needs at least one item.').max(120),
  requiredReadings: requiredReadingsInput.optional(),
});
export type ChecklistTemplateDto = {
  id: string;
  name: string;
  applianceKind: E.ApplianceKind;
  fuel: E.Fuel | null;
  items: z.output<typeof checklistItemTemplate>[];
  requiredReadings: z.output<typeof requiredReadingsInput>;
  updatedAt: string;
};

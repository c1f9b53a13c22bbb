import { sql } from 'drizzle-orm';
import {
  bigserial,
  boolean,
  check,
  date,
  index,
  integer,
  jsonb,
  numeric,
  pgEnum,
  pgTable,
  smallint,
  text,
  timestamp,
  uniqueIndex,
  uuid,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core';
import * as E from '../../../shared/schemas/enums';
import type { SwapCause } from '../../../shared/stats/swap-causes';
import { users } from './auth';
import { companies } from './companies';
import { createdAt, createdBy, id, updatedAt, updatedBy } from './columns';

export const applianceKind = pgEnum('appliance_kind', E.APPLIANCE_KINDS);
export const fuel = pgEnum('fuel', E.FUELS);
export const construction = pgEnum('construction', E.CONSTRUCTIONS);
export const ignitionType = pgEnum('ignition_type', E.IGNITION_TYPES);
export const ventType = pgEnum('vent_type', E.VENT_TYPES);
export const applianceStatus = pgEnum('appliance_status', E.APPLIANCE_STATUSES);
export const customerKind = pgEnum('customer_kind', E.CUSTOMER_KINDS);
export const visitType = pgEnum('visit_type', E.VISIT_TYPES);
export const visitStatus = pgEnum('visit_status', E.VISIT_STATUSES);
export const visitOutcome = pgEnum('visit_outcome', E.VISIT_OUTCOMES);
export const timelineKind = pgEnum('timeline_kind', E.TIMELINE_KINDS);

const companyId = () =>
  uuid('company_id')
    .notNull()
    .references(() => companies.id, { onDelete: 'cascade' });

export const customers = pgTable(
  'customers',
  {
    id: id(),
    companyId: companyId(),
    name: text('name').notNull(),
    kind: customerKind('kind').notNull().default('homeowner'),
    phone: text('phone'),
    email: text('email'),
    remindersOptOut: boolean('reminders_opt_out').notNull().default(false),
    notes: text('notes'),
    /** The customer's id in the system a company imported its records from (import re-runs match on it). */
    externalId: text('external_id'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    createdBy: createdBy(),
    updatedBy: updatedBy(),
  },
  (t) => [
    index('customers_company_name_idx').on(t.companyId, t.name, t.id),
    index('customers_name_trgm_idx').using('gin', sql`${t.name} gin_trgm_ops`),
    index('customers_phone_idx').on(t.companyId, t.phone),
    uniqueIndex('customers_company_external_id_uq').on(t.companyId, t.externalId).where(sql`${t.externalId} is not null`),
  ],
);

export const homeownerAccounts = pgTable(
  'homeowner_accounts',
  {
    id: id(),
    companyId: companyId(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    customerId: uuid('customer_id')
      .notNull()
      .references(() => customers.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('homeowner_accounts_user_customer_uq').on(t.userId, t.customerId)],
);

export const sites = pgTable(
  'sites',
  {
    id: id(),
    companyId: companyId(),
    customerId: uuid('customer_id')
      .notNull()
      .references(() => customers.id, { onDelete: 'restrict' }),
    street: text('street').notNull(),
    town: text('town').notNull(),
    postalCode: text('postal_code'),
    accessNotes: text('access_notes'),
    /** Feet above sea level; gas inputs are derated for altitude (NFPA 54) before the clocked input is judged. */
    elevationFt: integer('elevation_ft'),
    assignedTechnicianId: uuid('assigned_technician_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    createdBy: createdBy(),
    updatedBy: updatedBy(),
  },
  (t) => [
    index('sites_company_customer_idx').on(t.companyId, t.customerId),
    index('sites_street_trgm_idx').using('gin', sql`${t.street} gin_trgm_ops`),
    index('sites_company_town_idx').on(t.companyId, t.town),
  ],
);

export const appliances = pgTable(
  'appliances',
  {
    id: id(),
    companyId: companyId(),
    siteId: uuid('site_id')
      .notNull()
      .references(() => sites.id, { onDelete: 'restrict' }),
    kind: applianceKind('kind').notNull(),
    fuel: fuel('fuel').notNull(),
    construction: construction('construction').notNull(),
    manufacturer: text('manufacturer'),
    model: text('model'),
    serial: text('serial'),
    inputBtuh: integer('input_btuh'),
    firingRateGph: numeric('firing_rate_gph', { precision: 5, scale: 2, mode: 'number' }),
    grossOutputBtuh: integer('gross_output_btuh'),
    mawpPsi: numeric('mawp_psi', { precision: 6, scale: 1, mode: 'number' }),
    manufacturedMonth: smallint('manufactured_month'),
    manufacturedYear: smallint('manufactured_year'),
    installedOn: date('installed_on'),
    location: text('location'),
    ignitionType: ignitionType('ignition_type').notNull(),
    burnerCount: smallint('burner_count'),
    ventType: ventType('vent_type').notNull(),
    status: applianceStatus('status').notNull().default('in_service'),
    replacedById: uuid('replaced_by_id').references((): AnyPgColumn => appliances.id, { onDelete: 'set null' }),
    externalId: text('external_id'),
    /** The spreadsheet this record came from, when it was imported (import_files.id). */
    importId: uuid('import_id'),
    /** Copied from another company's record with the homeowner's consent (record_transfers.id): recorded by that company. */
    importedFromTransferId: uuid('imported_from_transfer_id').references((): AnyPgColumn => recordTransfers.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    createdBy: createdBy(),
    updatedBy: updatedBy(),
  },
  (t) => [
    index('appliances_company_site_idx').on(t.companyId, t.siteId),
    uniqueIndex('appliances_company_external_id_uq').on(t.companyId, t.externalId).where(sql`${t.externalId} is not null`),
    index('appliances_serial_trgm_idx').using('gin', sql`${t.serial} gin_trgm_ops`),
  ],
);

export const components = pgTable(
  'components',
  {
    id: id(),
    companyId: companyId(),
    applianceId: uuid('appliance_id')
      .notNull()
      .references(() => appliances.id, { onDelete: 'cascade' }),
    typeCode: text('type_code').notNull(),
    description: text('description'),
    spec: jsonb('spec').$type<Record<string, string | number>>().notNull().default({}),
    /** The spec formatted for stock counts, e.g. "24 in"; kept beside spec so grouping is a plain GROUP BY. */
    specKey: text('spec_key').notNull().default(''),
    installedOn: date('installed_on'),
    originalWithAppliance: boolean('original_with_appliance').notNull().default(false),
    note: text('note'),
    conditionFailed: boolean('condition_failed').notNull().default(false),
    conditionNote: text('condition_note'),
    lastInspectedOn: date('last_inspected_on'),
    removedOn: date('removed_on'),
    removalReason: text('removal_reason'),
    replacedById: uuid('replaced_by_id').references((): AnyPgColumn => components.id, { onDelete: 'set null' }),
    dueOn: date('due_on'),
    dueKind: text('due_kind').$type<'inspection' | 'replacement'>(),
    dueReason: text('due_reason'),
    /** Copied from another company's record with the homeowner's consent (record_transfers.id): recorded by that company. */
    importedFromTransferId: uuid('imported_from_transfer_id').references((): AnyPgColumn => recordTransfers.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    createdBy: createdBy(),
    updatedBy: updatedBy(),
  },
  (t) => [
    index('components_appliance_idx').on(t.applianceId),
    index('components_company_due_idx').on(t.companyId, t.dueOn, t.id).where(sql`${t.removedOn} is null`),
    index('components_company_type_idx').on(t.companyId, t.typeCode),
  ],
);

export type ChecklistItemTemplate = {
  key: string;
  section: string;
  label: string;
  caution?: string;
  readings?: string[];
};

/** Per visit type, the readings a visit must have (or skip with a reason) before it is completed. */
export type RequiredReadingsByVisitType = Partial<Record<E.VisitType, string[]>>;

export type ChecklistItemRecord = ChecklistItemTemplate & {
  mark: E.CheckMark | null;
  note: string;
};

export const checklistTemplates = pgTable(
  'checklist_templates',
  {
    id: id(),
    companyId: companyId(),
    name: text('name').notNull(),
    applianceKind: applianceKind('appliance_kind').notNull(),
    fuel: fuel('fuel'),
    items: jsonb('items').$type<ChecklistItemTemplate[]>().notNull(),
    requiredReadings: jsonb('required_readings').$type<RequiredReadingsByVisitType>().notNull().default({}),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    updatedBy: updatedBy(),
  },
  (t) => [index('checklist_templates_company_idx').on(t.companyId, t.applianceKind)],
);

export const visits = pgTable(
  'visits',
  {
    id: id(),
    companyId: companyId(),
    applianceId: uuid('appliance_id')
      .notNull()
      .references(() => appliances.id, { onDelete: 'cascade' }),
    type: visitType('type').notNull(),
    status: visitStatus('status').notNull().default('draft'),
    visitedOn: date('visited_on').notNull(),
    technicianIds: uuid('technician_ids').array().notNull().default(sql`'{}'::uuid[]`),
    arrivedAt: timestamp('arrived_at', { withTimezone: true }),
    departedAt: timestamp('departed_at', { withTimezone: true }),
    checklist: jsonb('checklist').$type<ChecklistItemRecord[]>().notNull().default([]),
    readings: jsonb('readings').$type<Record<string, unknown>>().notNull().default({}),
    /** Copied from the template when the visit starts, like the checklist, so a later template edit changes no visit. */
    requiredReadings: jsonb('required_readings').$type<string[]>().notNull().default([]),
    readingSkips: jsonb('reading_skips').$type<Record<string, string>>().notNull().default({}),
    results: jsonb('results').$type<Record<string, unknown>>().notNull().default({}),
    findings: text('findings').notNull().default(''),
    recommendations: text('recommendations').notNull().default(''),
    internalNotes: text('internal_notes').notNull().default(''),
    outcome: visitOutcome('outcome'),
    outcomeReason: text('outcome_reason'),
    outcomeToldWhom: text('outcome_told_whom'),
    outcomeToldAt: timestamp('outcome_told_at', { withTimezone: true }),
    signedOffBy: uuid('signed_off_by').references(() => users.id, { onDelete: 'set null' }),
    signedOffAt: timestamp('signed_off_at', { withTimezone: true }),
    customerAckName: text('customer_ack_name'),
    completedAt: timestamp('completed_at', { withTimezone: true }),
    /** Set on history brought in from a spreadsheet (import_files.id): recorded elsewhere, not signed off here. */
    importId: uuid('import_id'),
    /** The booking this visit was started from (bookings.id; the foreign key is in drizzle/0016_bookings_no_clash.sql). */
    bookingId: uuid('booking_id'),
    /** Copied from another company's record with the homeowner's consent (record_transfers.id): recorded by that company. */
    importedFromTransferId: uuid('imported_from_transfer_id').references((): AnyPgColumn => recordTransfers.id, { onDelete: 'set null' }),
    revision: integer('revision').notNull().default(0),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    createdBy: createdBy(),
    updatedBy: updatedBy(),
  },
  (t) => [
    index('visits_appliance_idx').on(t.applianceId, t.visitedOn),
    index('visits_company_idx').on(t.companyId, t.status),
    index('visits_booking_idx').on(t.bookingId),
  ],
);

export const visitAmendments = pgTable(
  'visit_amendments',
  {
    id: id(),
    companyId: companyId(),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    reason: text('reason').notNull(),
    changes: jsonb('changes').$type<Record<string, unknown>>().notNull(),
    createdAt: createdAt(),
    createdBy: createdBy(),
  },
  (t) => [index('visit_amendments_visit_idx').on(t.visitId, t.createdAt)],
);

export const partSwaps = pgTable(
  'part_swaps',
  {
    id: id(),
    companyId: companyId(),
    visitId: uuid('visit_id')
      .notNull()
      .references(() => visits.id, { onDelete: 'cascade' }),
    applianceId: uuid('appliance_id')
      .notNull()
      .references(() => appliances.id, { onDelete: 'cascade' }),
    removedComponentId: uuid('removed_component_id')
      .notNull()
      .references(() => components.id, { onDelete: 'cascade' }),
    newComponentId: uuid('new_component_id')
      .notNull()
      .references(() => components.id, { onDelete: 'cascade' }),
    swappedOn: date('swapped_on').notNull(),
    reason: text('reason'),
    /** Why the old part came out, for service-life estimates (shared/stats/swap-causes.ts). */
    cause: text('cause').$type<SwapCause>().notNull().default('wear_or_failure'),
    /** Copied from another company's record with the homeowner's consent (record_transfers.id): recorded by that company. */
    importedFromTransferId: uuid('imported_from_transfer_id').references((): AnyPgColumn => recordTransfers.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    createdBy: createdBy(),
  },
  (t) => [
    index('part_swaps_visit_idx').on(t.visitId),
    index('part_swaps_removed_component_idx').on(t.companyId, t.removedComponentId),
    check('part_swaps_cause_ck', sql`${t.cause} in ('wear_or_failure', 'upgrade', 'other')`),
  ],
);

/**
 * A one-time code that lets another company copy this appliance's life record, made by the homeowner or by the office at
 * the homeowner's request. Only the SHA-256 of the code is kept; it is used once (redeemed_at), or withdrawn, or expires.
 */
export const recordTransfers = pgTable(
  'record_transfers',
  {
    id: id(),
    companyId: companyId(),
    applianceId: uuid('appliance_id')
      .notNull()
      .references((): AnyPgColumn => appliances.id, { onDelete: 'cascade' }),
    codeHash: text('code_hash').notNull().unique(),
    /** 'office' (an owner or manager) or 'homeowner' (from their own record page). */
    madeBy: text('made_by').$type<'office' | 'homeowner'>().notNull(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    withdrawnAt: timestamp('withdrawn_at', { withTimezone: true }),
    redeemedAt: timestamp('redeemed_at', { withTimezone: true }),
    redeemedByCompanyId: uuid('redeemed_by_company_id').references(() => companies.id, { onDelete: 'set null' }),
    /** The sending company's name when the record was received, shown beside the copy even if the name changes later. */
    senderName: text('sender_name'),
    createdAt: createdAt(),
    createdBy: createdBy(),
  },
  (t) => [
    index('record_transfers_appliance_idx').on(t.companyId, t.applianceId, t.createdAt),
    check('record_transfers_made_by_ck', sql`${t.madeBy} in ('office', 'homeowner')`),
  ],
);

/** Append-only: one row per thing that happened to an appliance, written in the same transaction as the record. */
export const timelineEvents = pgTable(
  'timeline_events',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    companyId: companyId(),
    applianceId: uuid('appliance_id')
      .notNull()
      .references(() => appliances.id, { onDelete: 'cascade' }),
    occurredAt: timestamp('occurred_at', { withTimezone: true }).notNull(),
    kind: timelineKind('kind').notNull(),
    refId: uuid('ref_id'),
    summary: text('summary').notNull(),
    data: jsonb('data').$type<Record<string, unknown>>().notNull().default({}),
    homeownerVisible: boolean('homeowner_visible').notNull().default(true),
    actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [
    index('timeline_appliance_time_idx').on(t.applianceId, t.occurredAt.desc(), t.id.desc()),
    index('timeline_appliance_kind_time_idx').on(t.applianceId, t.kind, t.occurredAt.desc(), t.id.desc()),
  ],
);

export const auditLog = pgTable(
  'audit_log',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    companyId: companyId(),
    actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
    action: text('action').notNull(),
    entity: text('entity').notNull(),
    entityId: text('entity_id').notNull(),
    changes: jsonb('changes').$type<Record<string, unknown>>(),
    at: createdAt(),
  },
  (t) => [index('audit_log_entity_idx').on(t.companyId, t.entity, t.entityId, t.at)],
);

import { boolean, integer, jsonb, pgTable, text, unique, uniqueIndex } from 'drizzle-orm/pg-core';
import { applianceKind } from './records';
import { companies } from './companies';
import { id, updatedAt, updatedBy } from './columns';
import { uuid } from 'drizzle-orm/pg-core';
import type { DueRuleBasis } from '../../../shared/trade/due-dates';

export type SpecFieldDef = { key: string; label: string; unit?: string; options?: string[]; kind: 'number' | 'text' | 'choice' };

export const componentCatalog = pgTable(
  'component_catalog',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    code: text('code').notNull(),
    group: text('group').notNull(),
    label: text('label').notNull(),
    specFields: jsonb('spec_fields').$type<SpecFieldDef[]>().notNull().default([]),
    active: boolean('active').notNull().default(true),
    updatedAt: updatedAt(),
    updatedBy: updatedBy(),
  },
  (t) => [uniqueIndex('component_catalog_company_code_uq').on(t.companyId, t.code)],
);

export const dueRules = pgTable(
  'due_rules',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    componentType: text('component_type').notNull(),
    /** null: applies to every appliance kind; a kind-specific rule wins over it. */
    applianceKind: applianceKind('appliance_kind'),
    inspectionIntervalMonths: integer('inspection_interval_months'),
    replacementAgeYears: integer('replacement_age_years'),
    /**
     * A median life adopted from the company's own swaps: a planning age (inspect and plan; listed in the stock
     * forecast), never a replacement date. null: the ASHRAE planning median, where there is one, applies.
     */
    planningAgeYears: integer('planning_age_years'),
    replacementPolicy: text('replacement_policy').$type<'on_condition' | 'fixed_age' | 'annual'>().notNull(),
    basis: text('basis').$type<DueRuleBasis>().notNull(),
    source: text('source').notNull(),
    updatedAt: updatedAt(),
    updatedBy: updatedBy(),
  },
  (t) => [unique('due_rules_company_type_kind_uq').on(t.companyId, t.componentType, t.applianceKind).nullsNotDistinct()],
);

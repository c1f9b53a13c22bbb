import { sql } from 'drizzle-orm';
import { index, integer, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid, type AnyPgColumn } from 'drizzle-orm/pg-core';
import { TAG_FORMAT_IDS, TAG_STATUSES } from '../../../shared/schemas/tags';
import { users } from './auth';
import { companies } from './companies';
import { appliances } from './records';
import { createdAt, createdBy, id } from './columns';

export const tagFormat = pgEnum('tag_format', TAG_FORMAT_IDS);
export const tagStatus = pgEnum('tag_status', TAG_STATUSES);

export const tagBatches = pgTable(
  'tag_batches',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    format: tagFormat('format').notNull(),
    count: integer('count').notNull(),
    createdBy: createdBy(),
    createdAt: createdAt(),
  },
  (t) => [index('tag_batches_company_idx').on(t.companyId, t.createdAt)],
);

/**
 * A printed QR tag. A retired tag keeps its appliance, so an old sticker still opens the same record and never
 * another; only one tag per appliance is 'assigned' at a time.
 */
export const tags = pgTable(
  'tags',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    code: text('code').notNull(),
    batchId: uuid('batch_id')
      .notNull()
      .references(() => tagBatches.id, { onDelete: 'cascade' }),
    applianceId: uuid('appliance_id').references(() => appliances.id, { onDelete: 'cascade' }),
    status: tagStatus('status').notNull().default('unassigned'),
    assignedAt: timestamp('assigned_at', { withTimezone: true }),
    assignedBy: uuid('assigned_by').references(() => users.id, { onDelete: 'set null' }),
    retiredAt: timestamp('retired_at', { withTimezone: true }),
    retiredNote: text('retired_note'),
    replacedByTagId: uuid('replaced_by_tag_id').references((): AnyPgColumn => tags.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [
    // Globally unique: a scanned code must never be ambiguous between companies.
    uniqueIndex('tags_code_uq').on(t.code),
    uniqueIndex('tags_one_active_per_appliance_uq').on(t.applianceId).where(sql`${t.status} = 'assigned'`),
    index('tags_batch_idx').on(t.batchId),
    index('tags_company_appliance_idx').on(t.companyId, t.applianceId),
  ],
);

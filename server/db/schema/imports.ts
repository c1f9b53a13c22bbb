import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { IMPORT_STATUSES, type ImportCounts, type ImportSummary } from '../../../shared/schemas/imports';
import type { ImportField, ImportMapping } from '../../../shared/imports/import-fields';
import { companies } from './companies';
import { createdAt, createdBy, id } from './columns';

export const importStatus = pgEnum('import_status', IMPORT_STATUSES);

/** A spreadsheet a company brought its records in with: the file in object storage, its mapping and the run's progress. */
export const importFiles = pgTable(
  'import_files',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    fileName: text('file_name').notNull(),
    /** Null once the file has been deleted from object storage after the keeping time. */
    objectKey: text('object_key'),
    bytes: integer('bytes').notNull(),
    encoding: text('encoding').notNull(),
    headers: jsonb('headers').$type<string[]>().notNull(),
    rowCount: integer('row_count').notNull(),
    mapping: jsonb('mapping').$type<ImportMapping>().notNull().default({}),
    status: importStatus('status').notNull().default('uploaded'),
    rowsDone: integer('rows_done').notNull().default(0),
    errorRows: integer('error_rows').notNull().default(0),
    counts: jsonb('counts').$type<ImportCounts | null>(),
    summary: jsonb('summary').$type<ImportSummary | null>(),
    /** When a run last reported progress: a run that stops reporting is picked up again by the import job. */
    heartbeatAt: timestamp('heartbeat_at', { withTimezone: true }),
    startedAt: timestamp('started_at', { withTimezone: true }),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
    failure: text('failure'),
    createdBy: createdBy(),
    createdAt: createdAt(),
  },
  (t) => [index('import_files_company_idx').on(t.companyId, t.createdAt), index('import_files_status_idx').on(t.status, t.heartbeatAt)],
);

/** The company's last mapping by normalised header, so the next file from the same old system maps itself. */
export const importMappings = pgTable('import_mappings', {
  companyId: uuid('company_id')
    .primaryKey()
    .references(() => companies.id, { onDelete: 'cascade' }),
  byHeader: jsonb('by_header').$type<Record<string, ImportField>>().notNull().default({}),
  updatedAt: timestamp('updated_at', { withTimezone: true }).defaultNow().notNull(),
});

/**
 * Bringing a company's existing records in from a spreadsheet (CSV). Routes (under /api, `records:import`):
 *
 *   POST /imports                     multipart `file`        ImportFileDto (201)   the file kept, its columns read and mapped by guess
 *   GET  /imports                                             ImportFileDto[]       the company's recent files
 *   GET  /imports/:id                                         ImportFileDto         status and progress (poll while importing)
 *   POST /imports/:id/preview         { mapping }             ImportPreviewDto      dry run: nothing is written but the mapping
 *   POST /imports/:id/run             { mapping }             ImportFileDto         200 imported (up to 200 rows), or 202 running: poll GET /imports/:id
 *   GET  /imports/:id/errors.csv                              text/csv              the rows with errors, to fix and upload again
 */
import { z } from 'zod';
import { IMPORT_FIELD_KEYS, type ImportField, type ImportMapping } from '../imports/import-fields';
import type { ImportRowError } from '../imports/validate-import-row';
import { storableText } from './common';

export const IMPORT_STATUSES = ['uploaded', 'queued', 'importing', 'done', 'failed'] as const;
export type ImportStatus = (typeof IMPORT_STATUSES)[number];
export const MAX_IMPORT_BYTES = 20 * 1024 * 1024;
export const MAX_IMPORT_ROWS = 50_000;

export const importMappingInput = z.object({
  mapping: z.partialRecord(z.enum(IMPORT_FIELD_KEYS as [ImportField, ...ImportField[]], 'Not a field we import.'), storableText().max(200)),
});

export type EntityCounts = { create: number; update: number; skip: number };
export type ImportCounts = Record<'customers' | 'sites' | 'appliances' | 'parts' | 'visits', EntityCounts>;
export type ImportSummary = ImportCounts & { rows: number; errorRows: number; seconds: number };

export type ImportFileDto = {
  id: string;
  fileName: string;
  bytes: number;
  encoding: string;
  headers: string[];
  rowCount: number;
  mapping: ImportMapping;
  status: ImportStatus;
  rowsDone: number;
  errorRows: number;
  summary: ImportSummary | null;
  failure: string | null;
  createdAt: string;
  finishedAt: string | null;
};

export type ImportPreviewRow = {
  row: number;
  customer: string;
  site: string;
  appliance: string;
  parts: string[];
  visits: string[];
};

export type ImportPreviewDto = {
  rows: ImportPreviewRow[];
  errors: ImportRowError[];
  /** Every error is counted; at most this many are listed. */
  errorCount: number;
  errorRows: number;
  counts: ImportCounts;
  missingRequired: ImportField[];
};

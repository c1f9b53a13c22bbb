import { randomUUID } from 'node:crypto';
import Papa from 'papaparse';
import type { z } from 'zod';
import type { AppContext } from '../../context';
import { conflict, HttpError, notFound, validationFailed } from '../../lib/http-error';
import { guessMapping, mappingMemory } from '../../../shared/imports/guess-mapping';
import { IMPORT_FIELDS, REQUIRED_IMPORT_FIELDS, type ImportField, type ImportMapping } from '../../../shared/imports/import-fields';
import type { ImportFileDto, ImportPreviewDto, importMappingInput } from '../../../shared/schemas/imports';
import type { Principal } from '../../../shared/schemas/roles';
import { recordAudit } from '../../core/audit-log';
import { previewRows } from './import-plan';
import { importsRepository, type ImportFileRow } from './imports.repository';
import { loadImportFile, loadImportPlan } from './load-import-plan';
import { readImportFile } from './read-import-file';
import { runImport } from './run-import';

type Member = Extract<Principal, { kind: 'member' }>;
type MappingInput = z.output<typeof importMappingInput>;
const MAX_LISTED_ERRORS = 500;
/** A file this small is imported within the request (a second or so); a larger one in the background, with progress. */
export const INLINE_IMPORT_ROWS = 200;

export const toImportFileDto = (f: ImportFileRow): ImportFileDto => ({
  id: f.id,
  fileName: f.fileName,
  bytes: f.bytes,
  encoding: f.encoding,
  headers: f.headers,
  rowCount: f.rowCount,
  mapping: f.mapping,
  status: f.status,
  rowsDone: f.rowsDone,
  errorRows: f.errorRows,
  summary: f.summary,
  failure: f.failure,
  createdAt: f.createdAt.toISOString(),
  finishedAt: f.finishedAt?.toISOString() ?? null,
});

function checkMapping(file: ImportFileRow, mapping: ImportMapping) {
  const errors: Record<string, string[]> = {};
  const used = new Map<string, ImportField>();
  for (const [field, header] of Object.entries(mapping) as [ImportField, string][]) {
    if (!header) continue;
    if (!file.headers.includes(header)) errors[`mapping.${field}`] = [`The file has no column '${header}'.`];
    else if (used.has(header)) errors[`mapping.${field}`] = [`The column '${header}' is already read as ${IMPORT_FIELDS[used.get(header)!].label}.`];
    else used.set(header, field);
  }
  if (Object.keys(errors).length) throw validationFailed(errors);
}

export function importsService(ctx: AppContext) {
  const find = async (companyId: string, id: string) => {
    const file = await importsRepository.findFile(ctx.db, companyId, id);
    if (!file) throw notFound('Import');
    return file;
  };

  return {
    async upload(actor: Member, upload: { originalname: string; buffer: Buffer } | undefined): Promise<ImportFileDto> {
      if (!upload) throw new HttpError(400, 'import_file_rejected', 'Choose a CSV file to upload.', { file: ['Choose a CSV file to upload.'] });
      const parsed = readImportFile(upload.buffer);
      const id = randomUUID();
      const objectKey = `imports/${actor.companyId}/${id}.csv`;
      await ctx.storage.put(objectKey, upload.buffer, 'text/csv');
      const remembered = await importsRepository.rememberedMapping(ctx.db, actor.companyId);
      const fileName = upload.originalname.replace(/[\0\p{Cs}]/gu, '').slice(0, 200) || 'import.csv';
      const file = await ctx.db.transaction(async (tx) => {
        const row = await importsRepository.insertFile(tx, {
          id,
          companyId: actor.companyId,
          fileName,
          objectKey,
          bytes: upload.buffer.length,
          encoding: parsed.encoding,
          headers: parsed.headers,
          rowCount: parsed.rows.length,
          mapping: guessMapping(parsed.headers, remembered),
          createdBy: actor.userId,
        });
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'upload', entity: 'import_file', entityId: id, changes: { fileName, rows: parsed.rows.length } });
        return row;
      });
      return toImportFileDto(file);
    },

    list: async (companyId: string) => (await importsRepository.listFiles(ctx.db, companyId)).map(toImportFileDto),
    get: async (companyId: string, id: string) => toImportFileDto(await find(companyId, id)),

    async preview(actor: Member, id: string, input: MappingInput): Promise<ImportPreviewDto> {
      const file = await find(actor.companyId, id);
      checkMapping(file, input.mapping);
      const { plan } = await loadImportPlan(ctx, file, input.mapping);
      if (file.status !== 'queued' && file.status !== 'importing') await importsRepository.updateFile(ctx.db, actor.companyId, id, { mapping: input.mapping });
      await importsRepository.rememberMapping(ctx.db, actor.companyId, mappingMemory(input.mapping));
      return {
        rows: previewRows(plan),
        errors: plan.errors.slice(0, MAX_LISTED_ERRORS),
        errorCount: plan.errors.length,
        errorRows: plan.errorRowNumbers.size,
        counts: plan.counts,
        missingRequired: plan.missingRequired,
      };
    },

    async run(actor: Member, id: string, input: MappingInput): Promise<ImportFileDto> {
      const file = await find(actor.companyId, id);
      checkMapping(file, input.mapping);
      const missing = REQUIRED_IMPORT_FIELDS.filter((f) => !input.mapping[f]);
      if (missing.length) throw validationFailed(Object.fromEntries(missing.map((f) => [`mapping.${f}`, [`Choose the column for ${IMPORT_FIELDS[f].label}.`]])));
      const busy = await importsRepository.busyFile(ctx.db, actor.companyId);
      if (busy) throw conflict(`${busy.fileName} is being imported now. Wait for it to finish, then start this one.`);
      await loadImportFile(ctx, file);
      const queued = await ctx.db.transaction(async (tx) => {
        const row = await importsRepository.updateFile(tx, actor.companyId, id, {
          status: 'queued',
          mapping: input.mapping,
          rowsDone: 0,
          counts: null,
          summary: null,
          failure: null,
          startedAt: null,
          finishedAt: null,
          createdBy: actor.userId,
        });
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'queue', entity: 'import_file', entityId: id, changes: { mapping: input.mapping } });
        return row;
      });
      await importsRepository.rememberMapping(ctx.db, actor.companyId, mappingMemory(input.mapping));
      if (queued.rowCount <= INLINE_IMPORT_ROWS) {
        await runImport(ctx, actor.companyId, id);
        return toImportFileDto(await find(actor.companyId, id));
      }
      // Started at once, answered at once; should this process stop, the import job picks it up (server/jobs/import-job.ts).
      void runImport(ctx, actor.companyId, id).catch((err: unknown) => ctx.logger.warn({ err, importId: id }, 'import run did not finish'));
      return toImportFileDto(queued);
    },

    /** The rows that could not be imported, as they were, with what is wrong, ready to fix and upload again. */
    async errorsCsv(companyId: string, id: string): Promise<{ fileName: string; csv: string }> {
      const file = await find(companyId, id);
      const { parsed, plan } = await loadImportPlan(ctx, file, file.mapping);
      const byRow = new Map<number, string[]>();
      for (const e of plan.errors) byRow.set(e.row, [...(byRow.get(e.row) ?? []), `${e.column}: ${e.message}`]);
      const data = parsed.rows.map((cells, i) => ({ cells, row: i + 2 })).filter((r) => byRow.has(r.row));
      const csv = Papa.unparse(
        { fields: [...parsed.headers, 'What to fix'], data: data.map((r) => [...parsed.headers.map((_, c) => r.cells[c] ?? ''), `row ${r.row}: ${byRow.get(r.row)!.join('; ')}`]) },
        // A cell starting with = + - @ opens as a formula in a spreadsheet; escapeFormulae prefixes it with ' (CSV injection).
        { escapeFormulae: true, newline: '\r\n' },
      );
      return { fileName: file.fileName.replace(/\.csv$/i, '') + '-rows-to-fix.csv', csv };
    },
  };
}

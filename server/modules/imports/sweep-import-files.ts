import { and, isNotNull, lt } from 'drizzle-orm';
import type { AppContext } from '../../context';
import { importFiles } from '../../db/schema/index';
import { importsRepository } from './imports.repository';

/** Uploaded spreadsheets are kept this long for the audit trail (what was imported, from what), then deleted. */
export const IMPORT_FILE_KEEP_DAYS = 90;

/** Deletes kept files past their time from object storage; the import's row (name, counts, who) stays. */
export async function sweepImportFiles(ctx: AppContext, now = new Date()) {
  const cutoff = new Date(now.getTime() - IMPORT_FILE_KEEP_DAYS * 86_400_000);
  const old = await ctx.db
    .select({ id: importFiles.id, companyId: importFiles.companyId, objectKey: importFiles.objectKey })
    .from(importFiles)
    .where(and(isNotNull(importFiles.objectKey), lt(importFiles.createdAt, cutoff)))
    .limit(500);
  for (const f of old) {
    await ctx.storage.delete(f.objectKey!);
    await importsRepository.updateFile(ctx.db, f.companyId, f.id, { objectKey: null });
  }
  return { deleted: old.length };
}

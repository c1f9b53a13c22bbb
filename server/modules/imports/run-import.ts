import { and, eq, inArray, lt, or, sql } from 'drizzle-orm';
import type { AppContext } from '../../context';
import { importFiles } from '../../db/schema/index';
import { unavailableService } from '../../lib/unavailable';
import { recordAudit } from '../../core/audit-log';
import { recomputeDueForCompany } from '../due';
import { loadImportPlan } from './load-import-plan';
import { importsRepository } from './imports.repository';
import { writeImportBatch } from './write-import-batch';

export const IMPORT_BATCH_ROWS = 250;
const ANALYZE_AFTER_ROWS = 1000;
/** A run that has not reported for this long is taken to have stopped (a crash, a restart) and is picked up again. */
export const IMPORT_STALE_SECONDS = 120;

/**
 * Claims a queued import (or one whose run stopped reporting) and imports it batch by batch, each batch one
 * transaction, progress after each. A run picked up again plans against what the earlier run already wrote, so it
 * finds those records and writes only the rest: nothing twice. Due dates are recomputed once, at the end.
 */
export async function runImport(ctx: AppContext, companyId: string, importId: string): Promise<'done' | 'not_claimed' | 'failed' | 'interrupted'> {
  const [claimed] = await ctx.db
    .update(importFiles)
    .set({ status: 'importing', heartbeatAt: new Date(), startedAt: sql`coalesce(${importFiles.startedAt}, now())` })
    .where(
      and(
        eq(importFiles.companyId, companyId),
        eq(importFiles.id, importId),
        or(
          eq(importFiles.status, 'queued'),
          and(eq(importFiles.status, 'importing'), lt(importFiles.heartbeatAt, new Date(Date.now() - IMPORT_STALE_SECONDS * 1000))),
        ),
      ),
    )
    .returning();
  if (!claimed) return 'not_claimed';
  const began = Date.now();
  try {
    const { plan, today } = await loadImportPlan(ctx, claimed, claimed.mapping);
    const counts = claimed.counts ?? plan.counts;
    await importsRepository.updateFile(ctx.db, companyId, importId, { counts, errorRows: plan.errorRowNumbers.size });
    const source = { importId, fileName: claimed.fileName, importedOn: today, companyId, actorId: claimed.createdBy };
    for (let i = 0; i < plan.rows.length; i += IMPORT_BATCH_ROWS) {
      const batch = plan.rows.slice(i, i + IMPORT_BATCH_ROWS);
      await ctx.db.transaction(async (tx) => {
        await writeImportBatch(tx, source, batch);
        // Rows are in file order, so the batch's last row number tells how far through the file the import is.
        await importsRepository.updateFile(tx, companyId, importId, { rowsDone: batch[batch.length - 1].row.row - 1, heartbeatAt: new Date() });
      });
    }
    // Freshly loaded rows have no planner statistics until autovacuum gets to them, and the due recompute planned
    // for a company the planner thinks is empty took 47 s instead of 1 s for 10,000 appliances. PostgreSQL's
    // manual, "Populating a Database" (14.4.8, Run ANALYZE Afterwards), advises exactly this after a bulk load.
    if (plan.rows.length >= ANALYZE_AFTER_ROWS) await ctx.pool.query('analyze customers, sites, appliances, components, visits');
    await ctx.db.transaction(async (tx) => {
      await recomputeDueForCompany(tx, companyId, { today });
      const seconds = Math.round((Date.now() - began) / 100) / 10;
      const summary = { ...counts, rows: claimed.rowCount, errorRows: plan.errorRowNumbers.size, seconds };
      await importsRepository.updateFile(tx, companyId, importId, { status: 'done', rowsDone: claimed.rowCount, summary, finishedAt: new Date(), failure: null });
      await recordAudit(tx, { companyId, actorId: claimed.createdBy, action: 'import', entity: 'import_file', entityId: importId, changes: { fileName: claimed.fileName, ...summary } });
    });
    return 'done';
  } catch (err) {
    if (unavailableService(err)) {
      // The database or the file store is away: leave it to the import job, which picks the run up again.
      ctx.logger.warn({ err, importId }, 'import interrupted; it will be picked up again');
      return 'interrupted';
    }
    ctx.logger.error({ err, importId }, 'import failed');
    await importsRepository.updateFile(ctx.db, companyId, importId, {
      status: 'failed',
      failure: 'The import stopped on an error of ours. The rows imported so far are kept; run it again to finish (nothing is imported twice).',
      finishedAt: new Date(),
    });
    return 'failed';
  }
}

/** Imports waiting for a run, or whose run stopped reporting (for the import job). */
export async function importsToResume(ctx: AppContext) {
  return ctx.db
    .select({ id: importFiles.id, companyId: importFiles.companyId })
    .from(importFiles)
    .where(
      or(
        eq(importFiles.status, 'queued'),
        and(inArray(importFiles.status, ['importing']), lt(importFiles.heartbeatAt, new Date(Date.now() - IMPORT_STALE_SECONDS * 1000))),
      ),
    )
    .limit(10);
}

import type { AppContext } from '../context';
import { importsToResume, runImport } from '../modules/imports';
import { sweepImportFiles } from '../modules/imports';

export const IMPORT_QUEUE = 'imports';
/** Every minute: imports whose run stopped (a restart mid-file) are picked up again, and old kept files deleted. */
export const IMPORT_CRON = '* * * * *';

export async function importJob(ctx: AppContext) {
  let resumed = 0;
  for (const f of await importsToResume(ctx)) if ((await runImport(ctx, f.companyId, f.id)) === 'done') resumed++;
  const { deleted } = await sweepImportFiles(ctx);
  return { resumed, deleted };
}

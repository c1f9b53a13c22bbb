import type { AppContext } from '../../context';
import type { DbOrTx } from '../../db/client';
import { gone } from '../../lib/http-error';
import type { ImportMapping } from '../../../shared/imports/import-fields';
import { COMPONENT_TYPES, type ComponentType } from '../../../shared/trade/component-types';
import { catalogLabels } from '../catalog';
import { companyToday } from '../../core/company-today';
import { dropKnownHistory, planImport } from './import-plan';
import { importsRepository, type ImportFileRow } from './imports.repository';
import { nameKey } from './match-keys';
import { readImportFile, type ParsedImportFile } from './read-import-file';

/** The company's active part types by code and by label, as a spreadsheet names them. */
async function partTypesOf(db: DbOrTx, companyId: string) {
  const catalog = await catalogLabels(db, companyId);
  const out = new Map<string, ComponentType>();
  for (const [code, entry] of catalog) {
    if (!entry.active || !(code in COMPONENT_TYPES)) continue;
    const type = code as ComponentType;
    out.set(nameKey(code), type);
    out.set(nameKey(entry.label), type);
    out.set(nameKey(COMPONENT_TYPES[type].label), type);
  }
  return out;
}

export async function loadImportFile(ctx: AppContext, file: ImportFileRow): Promise<ParsedImportFile> {
  if (!file.objectKey) throw gone(`The file ${file.fileName} was deleted after its keeping time. Upload it again.`);
  const object = await ctx.storage.get(file.objectKey);
  return readImportFile(object.body);
}

/** Reads the kept file and decides, against the company's records as they are now, what importing it would do. */
export async function loadImportPlan(ctx: AppContext, file: ImportFileRow, mapping: ImportMapping) {
  const parsed = await loadImportFile(ctx, file);
  const [today, partTypes, existing] = await Promise.all([
    companyToday(ctx.db, file.companyId),
    partTypesOf(ctx.db, file.companyId),
    importsRepository.existingRecords(ctx.db, file.companyId),
  ]);
  const plan = planImport({ headers: parsed.headers, rows: parsed.rows, mapping, today, partTypes, existing });
  const known = await importsRepository.historyKeys(ctx.db, file.companyId, plan.existingApplianceIds);
  return { parsed, today, plan: dropKnownHistory(plan, known) };
}

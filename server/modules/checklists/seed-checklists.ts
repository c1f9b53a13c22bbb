import type { DbOrTx } from '../../db/client';
import { checklistTemplates } from '../../db/schema/index';
import { DEFAULT_CHECKLISTS } from './default-checklists';

export async function seedCompanyChecklists(db: DbOrTx, companyId: string) {
  await db.insert(checklistTemplates).values(DEFAULT_CHECKLISTS.map((t) => ({ companyId, ...t })));
}

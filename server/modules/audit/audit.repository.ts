import type { DbOrTx } from '../../db/client';
import { auditLog } from '../../db/schema/index';

export async function recordAudit(
  db: DbOrTx,
  entry: { companyId: string; actorId: string; action: string; entity: string; entityId: string; changes?: Record<string, unknown> },
) {
  await db.insert(auditLog).values(entry);
}

import type { DbOrTx } from '../db/client';
import { auditLog } from '../db/schema/index';

export async function recordAudit(
  db: DbOrTx,
  /** actorId is null when no one signed in did it (a homeowner through a share link). */
  entry: { companyId: string; actorId: string | null; action: string; entity: string; entityId: string; changes?: Record<string, unknown> },
) {
  await db.insert(auditLog).values(entry);
}

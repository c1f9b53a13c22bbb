import { eq } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { recordTransfers } from '../../db/schema/index';
import type { TransferProvenanceDto } from '../../../shared/schemas/record-transfers';

/** Who recorded a copied record and when it arrived: the sender's name as it was then, nothing else of the sender. */
export async function transferProvenance(db: DbOrTx, transferId: string | null): Promise<TransferProvenanceDto | null> {
  if (!transferId) return null;
  const [row] = await db
    .select({ senderName: recordTransfers.senderName, redeemedAt: recordTransfers.redeemedAt })
    .from(recordTransfers)
    .where(eq(recordTransfers.id, transferId));
  return row?.redeemedAt ? { senderName: row.senderName ?? 'another company', receivedAt: row.redeemedAt.toISOString() } : null;
}

import crypto from 'node:crypto';
import type { DbOrTx } from '../../db/client';
import { gone, notFound } from '../../lib/http-error';
import { SHARE_LINK_GONE_MESSAGE } from '../../../shared/schemas/homeowner';
import { shareLinksRepository as repo } from './share-links.repository';

export const hashShareToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

/**
 * The active link behind a token, for every public route under /share/:token. Unknown tokens answer 404, expired or
 * revoked ones 410, and neither says anything about the appliance.
 */
export async function resolveShareToken(db: DbOrTx, token: string) {
  const row = await repo.findByHash(db, hashShareToken(token));
  if (!row) throw notFound('Share link');
  if (row.revokedAt || row.expiresAt <= new Date()) throw gone(SHARE_LINK_GONE_MESSAGE);
  return row;
}

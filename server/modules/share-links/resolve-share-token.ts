import crypto from 'node:crypto';
import type { DbOrTx } from '../../db/client';
import { HttpError, notFound } from '../../lib/http-error';
import { SHARE_LINK_GONE_CODES, shareLinkGoneMessage } from '../../../shared/glossary/share-links';
import { findCompanyContact } from '../../core/tenant-finders';
import { shareLinksRepository as repo } from './share-links.repository';

export const hashShareToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

/**
 * The active link behind a token, for every public route under /share/:token. Unknown tokens answer 404; a link the
 * company withdrew answers 410 `share_link_revoked`, one whose time ran out 410 `share_link_expired`, each naming the
 * company and its phone to ask for a new one and saying nothing about the appliance.
 */
export async function resolveShareToken(db: DbOrTx, token: string) {
  const row = await repo.findByHash(db, hashShareToken(token));
  if (!row) throw notFound('Share link');
  const why = row.revokedAt ? 'revoked' : row.expiresAt <= new Date() ? 'expired' : null;
  if (why) {
    const company = await findCompanyContact(db, row.companyId);
    throw new HttpError(410, SHARE_LINK_GONE_CODES[why], shareLinkGoneMessage(why, company));
  }
  return row;
}

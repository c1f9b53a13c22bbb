import { and, eq, gt } from 'drizzle-orm';
import type { Db } from '../db/client';
import { homeownerAccounts, memberships, sessions } from '../db/schema/index';
import type { Principal } from '../../shared/schemas/roles';

/**
 * Who a signed-in user is to Lifeplate, read on every request. 'ended' is a session that no longer counts though
 * its cookie may still carry it for up to a minute (better-auth's cookie cache): its row is gone (signed out,
 * here or on another device; a deactivated member's sessions are deleted too) or expired, or the member was
 * deactivated. The session row is read in the same query as the membership, so this costs no extra round trip.
 */
export async function findPrincipal(db: Db, session: { id: string; userId: string }): Promise<Principal | 'ended' | null> {
  const [row] = await db
    .select({ companyId: memberships.companyId, role: memberships.role, deactivatedAt: memberships.deactivatedAt })
    .from(sessions)
    .leftJoin(memberships, eq(memberships.userId, sessions.userId))
    .where(and(eq(sessions.id, session.id), eq(sessions.userId, session.userId), gt(sessions.expiresAt, new Date())))
    .limit(1);
  if (!row || row.deactivatedAt) return 'ended';
  const userId = session.userId;
  if (row.companyId && row.role) return { kind: 'member', userId, companyId: row.companyId, role: row.role };
  const links = await db
    .select({ companyId: homeownerAccounts.companyId, customerId: homeownerAccounts.customerId })
    .from(homeownerAccounts)
    .where(eq(homeownerAccounts.userId, userId));
  if (!links.length) return null;
  return { kind: 'homeowner', userId, companyId: links[0].companyId, customerIds: links.map((l) => l.customerId) };
}

import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { homeownerAccounts, memberships } from '../db/schema/index';
import type { Principal } from '../../shared/schemas/roles';

/**
 * Who a signed-in user is to Lifeplate. 'deactivated' is a member whose membership was ended: their sessions are
 * deleted at once, and a session still cached in their cookie must count as signed out too.
 */
export async function findPrincipal(db: Db, userId: string): Promise<Principal | 'deactivated' | null> {
  const [member] = await db
    .select({ companyId: memberships.companyId, role: memberships.role, deactivatedAt: memberships.deactivatedAt })
    .from(memberships)
    .where(eq(memberships.userId, userId))
    .limit(1);
  if (member?.deactivatedAt) return 'deactivated';
  if (member) return { kind: 'member', userId, companyId: member.companyId, role: member.role };
  const links = await db
    .select({ companyId: homeownerAccounts.companyId, customerId: homeownerAccounts.customerId })
    .from(homeownerAccounts)
    .where(eq(homeownerAccounts.userId, userId));
  if (!links.length) return null;
  return { kind: 'homeowner', userId, companyId: links[0].companyId, customerIds: links.map((l) => l.customerId) };
}

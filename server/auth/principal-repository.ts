import { and, eq, isNull } from 'drizzle-orm';
import type { Db } from '../db/client';
import { homeownerAccounts, memberships } from '../db/schema/index';
import type { Principal } from '../../shared/schemas/roles';

export async function findPrincipal(db: Db, userId: string): Promise<Principal | null> {
  const [member] = await db
    .select({ companyId: memberships.companyId, role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), isNull(memberships.deactivatedAt)))
    .limit(1);
  if (member) return { kind: 'member', userId, companyId: member.companyId, role: member.role };
  const links = await db
    .select({ companyId: homeownerAccounts.companyId, customerId: homeownerAccounts.customerId })
    .from(homeownerAccounts)
    .where(eq(homeownerAccounts.userId, userId));
  if (!links.length) return null;
  return { kind: 'homeowner', userId, companyId: links[0].companyId, customerIds: links.map((l) => l.customerId) };
}

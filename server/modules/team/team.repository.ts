import { and, asc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { memberships, sessions, users } from '../../db/schema/index';
import type { MemberRole } from '../../../shared/schemas/roles';

const memberColumns = {
  id: memberships.id,
  userId: memberships.userId,
  role: memberships.role,
  deactivatedAt: memberships.deactivatedAt,
  name: users.name,
  email: users.email,
};

export const teamRepository = {
  list(db: DbOrTx, companyId: string) {
    return db
      .select(memberColumns)
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.companyId, companyId))
      .orderBy(asc(users.name));
  },
  async find(db: DbOrTx, companyId: string, membershipId: string) {
    const [row] = await db
      .select(memberColumns)
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.companyId, companyId), eq(memberships.id, membershipId)))
      .limit(1);
    return row ?? null;
  },
  async setRole(db: DbOrTx, companyId: string, membershipId: string, role: MemberRole) {
    await db.update(memberships).set({ role }).where(and(eq(memberships.companyId, companyId), eq(memberships.id, membershipId)));
  },
  async deactivate(db: DbOrTx, companyId: string, membershipId: string, userId: string) {
    await db
      .update(memberships)
      .set({ deactivatedAt: new Date() })
      .where(and(eq(memberships.companyId, companyId), eq(memberships.id, membershipId)));
    // Deactivation ends every session at once, not at their expiry.
    await db.delete(sessions).where(eq(sessions.userId, userId));
  },
};

import { and, desc, eq, gt, isNull } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { DbOrTx } from '../../db/client';
import { companies, customers, homeownerAccounts, invitations, memberships, users } from '../../db/schema/index';

export type InvitationRow = typeof invitations.$inferSelect;
type NewInvitation = Omit<typeof invitations.$inferInsert, 'id'>;

const inviter = alias(users, 'inviter');
const withInviter = { invitation: invitations, invitedByName: inviter.name };

const openNow = () => and(isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date()));

export const invitationsRepository = {
  async insert(db: DbOrTx, values: NewInvitation) {
    const [row] = await db.insert(invitations).values(values).returning();
    return row;
  },
  async find(db: DbOrTx, companyId: string, id: string) {
    const [row] = await db
      .select(withInviter)
      .from(invitations)
      .leftJoin(inviter, eq(inviter.id, invitations.invitedBy))
      .where(and(eq(invitations.companyId, companyId), eq(invitations.id, id)))
      .limit(1);
    return row ?? null;
  },
  /** Member invitations still waiting for an answer (open or lapsed), newest first. */
  listPendingMembers(db: DbOrTx, companyId: string) {
    return db
      .select(withInviter)
      .from(invitations)
      .leftJoin(inviter, eq(inviter.id, invitations.invitedBy))
      .where(and(eq(invitations.companyId, companyId), eq(invitations.kind, 'member'), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
      .orderBy(desc(invitations.createdAt));
  },
  async findOpenMemberInvitation(db: DbOrTx, companyId: string, email: string) {
    const [row] = await db
      .select({ id: invitations.id })
      .from(invitations)
      .where(and(eq(invitations.companyId, companyId), eq(invitations.kind, 'member'), eq(invitations.email, email), openNow()))
      .limit(1);
    return row ?? null;
  },
  async update(db: DbOrTx, companyId: string, id: string, values: Partial<NewInvitation>) {
    const [row] = await db
      .update(invitations)
      .set(values)
      .where(and(eq(invitations.companyId, companyId), eq(invitations.id, id)))
      .returning();
    return row;
  },
  /** Null when someone got there first (accepted or revoked in the meantime). */
  async markAccepted(db: DbOrTx, id: string, userId: string) {
    const [row] = await db
      .update(invitations)
      .set({ acceptedAt: new Date(), acceptedBy: userId })
      .where(and(eq(invitations.id, id), openNow()))
      .returning();
    return row ?? null;
  },
  /** For the invited person: found only with their own address, whatever company sent it. */
  async findForInvitee(db: DbOrTx, id: string, email: string) {
    const [row] = await db
      .select({ invitation: invitations, companyName: companies.name })
      .from(invitations)
      .innerJoin(companies, eq(companies.id, invitations.companyId))
      .where(and(eq(invitations.id, id), eq(invitations.email, email.toLowerCase())))
      .limit(1);
    return row ?? null;
  },
  /** What the invitation e-mail names: the company, who sent it and, for a homeowner, the customer. */
  async findOpenForMail(db: DbOrTx, id: string, email: string) {
    const [row] = await db
      .select({ invitation: invitations, companyName: companies.name, invitedByName: inviter.name, customerName: customers.name })
      .from(invitations)
      .innerJoin(companies, eq(companies.id, invitations.companyId))
      .leftJoin(inviter, eq(inviter.id, invitations.invitedBy))
      .leftJoin(customers, eq(customers.id, invitations.customerId))
      .where(and(eq(invitations.id, id), eq(invitations.email, email.toLowerCase()), openNow()))
      .limit(1);
    return row ?? null;
  },
  async hasOpenInvitation(db: DbOrTx, email: string) {
    const [row] = await db
      .select({ id: invitations.id })
      .from(invitations)
      .where(and(eq(invitations.email, email.toLowerCase()), openNow()))
      .limit(1);
    return Boolean(row);
  },
  async findUserByEmail(db: DbOrTx, email: string) {
    const [row] = await db.select().from(users).where(eq(users.email, email.toLowerCase())).limit(1);
    return row ?? null;
  },
  async findUser(db: DbOrTx, userId: string) {
    const [row] = await db.select().from(users).where(eq(users.id, userId)).limit(1);
    return row ?? null;
  },
  /** Any membership, active or not: one company per user. */
  async findMembership(db: DbOrTx, userId: string) {
    const [row] = await db.select().from(memberships).where(eq(memberships.userId, userId)).limit(1);
    return row ?? null;
  },
  async homeownerCompanies(db: DbOrTx, userId: string) {
    const rows = await db.selectDistinct({ companyId: homeownerAccounts.companyId }).from(homeownerAccounts).where(eq(homeownerAccounts.userId, userId));
    return rows.map((r) => r.companyId);
  },
  /** Someone Lifeplate already knows: an active team member or a homeowner. */
  async isKnownPerson(db: DbOrTx, email: string) {
    const user = await this.findUserByEmail(db, email);
    if (!user) return false;
    const [member] = await db
      .select({ id: memberships.id })
      .from(memberships)
      .where(and(eq(memberships.userId, user.id), isNull(memberships.deactivatedAt)))
      .limit(1);
    if (member) return true;
    return (await this.homeownerCompanies(db, user.id)).length > 0;
  },
  async insertMembership(db: DbOrTx, values: typeof memberships.$inferInsert) {
    await db.insert(memberships).values(values);
  },
  async linkHomeowner(db: DbOrTx, values: { companyId: string; userId: string; customerId: string }) {
    await db.insert(homeownerAccounts).values(values).onConflictDoNothing();
  },
  async setUserName(db: DbOrTx, userId: string, name: string) {
    await db.update(users).set({ name }).where(eq(users.id, userId));
  },
};

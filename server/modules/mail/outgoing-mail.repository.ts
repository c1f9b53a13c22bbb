import { and, desc, eq, inArray, ne, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { outgoingMail } from '../../db/schema/index';
import type { MailKind, MailStatus } from '../../../shared/schemas/mail';

export type OutgoingMailRow = typeof outgoingMail.$inferSelect;
export type MailFilter = { companyIds?: string[]; ids?: string[] };

const claimable = (now: Date) =>
  and(inArray(outgoingMail.status, ['queued', 'sending']), sql`${outgoingMail.nextAttemptAt} <= ${now.toISOString()}::timestamptz`);

export const outgoingMailRepository = {
  async insert(db: DbOrTx, values: typeof outgoingMail.$inferInsert) {
    const [row] = await db.insert(outgoingMail).values(values).returning({ id: outgoingMail.id });
    return row.id;
  },

  /** A newer message about the same record replaces the ones still waiting (a fresh link supersedes an older one). */
  async cancelQueued(db: DbOrTx, kind: MailKind, refId: string) {
    await db
      .update(outgoingMail)
      .set({ status: 'cancelled', sealed: null })
      .where(and(eq(outgoingMail.kind, kind), eq(outgoingMail.refId, refId), eq(outgoingMail.status, 'queued')));
  },

  /** The first try right after the message was written: only while nobody else has started on it. */
  async claimFresh(db: DbOrTx, id: string, leaseUntil: Date) {
    const [row] = await db
      .update(outgoingMail)
      .set({ status: 'sending', attempts: sql`${outgoingMail.attempts} + 1`, nextAttemptAt: leaseUntil })
      .where(and(eq(outgoingMail.id, id), eq(outgoingMail.status, 'queued'), eq(outgoingMail.attempts, 0)))
      .returning();
    return row ?? null;
  },

  /** The oldest due message (queued, or a try abandoned past its lease); SKIP LOCKED lets several senders share the queue. */
  async claimNextDue(db: DbOrTx, now: Date, leaseUntil: Date, filter: MailFilter) {
    const next = db
      .select({ id: outgoingMail.id })
      .from(outgoingMail)
      .where(
        and(
          claimable(now),
          filter.companyIds ? inArray(outgoingMail.companyId, filter.companyIds) : undefined,
          filter.ids ? inArray(outgoingMail.id, filter.ids) : undefined,
        ),
      )
      .orderBy(outgoingMail.nextAttemptAt)
      .limit(1)
      .for('update', { skipLocked: true });
    const [row] = await db
      .update(outgoingMail)
      .set({ status: 'sending', attempts: sql`${outgoingMail.attempts} + 1`, nextAttemptAt: leaseUntil })
      .where(inArray(outgoingMail.id, next))
      .returning();
    return row ?? null;
  },

  async markSent(db: DbOrTx, id: string, at: Date, messageId: string) {
    await db.update(outgoingMail).set({ status: 'sent', sentAt: at, messageId, sealed: null, lastError: null }).where(eq(outgoingMail.id, id));
  },

  async markNotSent(db: DbOrTx, id: string, values: { status: Extract<MailStatus, 'queued' | 'failed'>; nextAttemptAt: Date; lastError: string }) {
    await db
      .update(outgoingMail)
      .set({ ...values, ...(values.status === 'failed' ? { sealed: null } : {}) })
      .where(eq(outgoingMail.id, id));
  },

  async status(db: DbOrTx, id: string): Promise<MailStatus | null> {
    const [row] = await db.select({ status: outgoingMail.status }).from(outgoingMail).where(eq(outgoingMail.id, id));
    return row?.status ?? null;
  },

  /** The newest message (not replaced) about each of the given records. */
  async latestStatuses(db: DbOrTx, kind: MailKind, refIds: string[]): Promise<Map<string, MailStatus>> {
    if (!refIds.length) return new Map();
    const rows = await db
      .selectDistinctOn([outgoingMail.refId], { refId: outgoingMail.refId, status: outgoingMail.status })
      .from(outgoingMail)
      .where(and(eq(outgoingMail.kind, kind), inArray(outgoingMail.refId, refIds), ne(outgoingMail.status, 'cancelled')))
      .orderBy(outgoingMail.refId, desc(outgoingMail.createdAt));
    return new Map(rows.map((r) => [r.refId!, r.status]));
  },
};

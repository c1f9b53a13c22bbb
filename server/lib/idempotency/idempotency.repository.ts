import { and, eq, lt } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { idempotencyKeys } from '../../db/schema/index';

export type KeyScope = { companyId: string; userId: string; key: string };
export type KeyRow = typeof idempotencyKeys.$inferSelect;

const byScope = (s: KeyScope) =>
  and(eq(idempotencyKeys.companyId, s.companyId), eq(idempotencyKeys.userId, s.userId), eq(idempotencyKeys.key, s.key));

/** Every statement here runs on its own (not in the route's transaction), so a claim is visible to a concurrent request at once. */
export const idempotencyRepository = {
  /** Writes the in-progress row; false when the key already has one (the primary key decides, under any concurrency). */
  async claim(db: Db, scope: KeyScope, request: { method: string; path: string; fingerprint: string; now: Date }) {
    const rows = await db
      .insert(idempotencyKeys)
      .values({ ...scope, method: request.method, path: request.path, fingerprint: request.fingerprint, status: 'in_progress', createdAt: request.now })
      .onConflictDoNothing()
      .returning({ key: idempotencyKeys.key });
    return rows.length === 1;
  },

  async find(db: Db, scope: KeyScope): Promise<KeyRow | undefined> {
    const [row] = await db.select().from(idempotencyKeys).where(byScope(scope)).limit(1);
    return row;
  },

  async complete(db: Db, scope: KeyScope, response: { status: number; body: unknown }) {
    await db
      .update(idempotencyKeys)
      .set({ status: 'done', responseStatus: response.status, responseBody: response.body ?? null })
      .where(and(byScope(scope), eq(idempotencyKeys.status, 'in_progress')));
  },

  async release(db: Db, scope: KeyScope) {
    await db.delete(idempotencyKeys).where(and(byScope(scope), eq(idempotencyKeys.status, 'in_progress')));
  },

  /** Frees a claim left in progress by a request that never finished (the process died mid-request). */
  async releaseStale(db: Db, scope: KeyScope, claimedBefore: Date) {
    const rows = await db
      .delete(idempotencyKeys)
      .where(and(byScope(scope), eq(idempotencyKeys.status, 'in_progress'), lt(idempotencyKeys.createdAt, claimedBefore)))
      .returning({ key: idempotencyKeys.key });
    return rows.length === 1;
  },

  async deleteOlderThan(db: Db, before: Date) {
    const rows = await db.delete(idempotencyKeys).where(lt(idempotencyKeys.createdAt, before)).returning({ key: idempotencyKeys.key });
    return rows.length;
  },
};

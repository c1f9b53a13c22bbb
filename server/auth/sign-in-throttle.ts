import { createHmac } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { signInThrottle } from '../db/schema/index';

/** Attempts allowed before the first lock; each later one locks the address for twice as long, up to an hour. */
export const SIGN_IN_FREE_ATTEMPTS = 5;
const FIRST_LOCK_SECONDS = 60;
const LONGEST_LOCK_SECONDS = 3600;
/** A day without attempts starts the count again. */
const QUIET_RESET_MS = 24 * 3600 * 1000;

export type ThrottleState = { attempts: number; lastAttemptAt: Date; lockedUntil: Date | null };
export type ThrottleDecision = { allowed: true; next: ThrottleState } | { allowed: false; retryAfterSeconds: number };

// common practice: per-account exponential backoff (OWASP Authentication Cheat Sheet, "Account Lockout"); at the
// longest lock an address gets about 24 tries a day, well under the 100 that NIST SP 800-63B section 5.2.2 allows.
export function lockSecondsAfter(attempt: number): number {
  if (attempt < SIGN_IN_FREE_ATTEMPTS) return 0;
  return Math.min(FIRST_LOCK_SECONDS * 2 ** (attempt - SIGN_IN_FREE_ATTEMPTS), LONGEST_LOCK_SECONDS);
}

/**
 * Whether a password attempt may be tried now. The attempt is counted before the password is checked (so attempts
 * sent at once cannot all slip past), and its lock is set at once; a successful sign-in clears both.
 */
export function decideAttempt(state: ThrottleState | null, now: Date): ThrottleDecision {
  if (state?.lockedUntil && state.lockedUntil > now) {
    return { allowed: false, retryAfterSeconds: Math.ceil((state.lockedUntil.getTime() - now.getTime()) / 1000) };
  }
  const fresh = !state || now.getTime() - state.lastAttemptAt.getTime() > QUIET_RESET_MS;
  const attempts = (fresh ? 0 : state.attempts) + 1;
  const lock = lockSecondsAfter(attempts);
  return { allowed: true, next: { attempts, lastAttemptAt: now, lockedUntil: lock ? new Date(now.getTime() + lock * 1000) : null } };
}

/** Counted in the database per typed address, whether or not an account has it. */
export function createSignInThrottle(db: Db, secret: string) {
  const keyOf = (email: string) => createHmac('sha256', secret).update(`sign-in:${email.trim().toLowerCase()}`).digest('base64url');
  return {
    keyOf,
    async attempt(email: string, now = new Date()): Promise<ThrottleDecision> {
      const key = keyOf(email);
      return db.transaction(async (tx) => {
        // One statement that makes or locks the row: a sign-in clearing it at the same moment cannot leave it missing.
        const [row] = await tx
          .insert(signInThrottle)
          .values({ key, attempts: 0, lastAttemptAt: now })
          .onConflictDoUpdate({ target: signInThrottle.key, set: { key: sql`excluded.key` } })
          .returning();
        const decision = decideAttempt(row.attempts ? row : null, now);
        if (decision.allowed) await tx.update(signInThrottle).set(decision.next).where(eq(signInThrottle.key, key));
        return decision;
      });
    },
    /** An attempt that never reached the password check (the sign-in failed for another reason) does not count. */
    async refund(email: string) {
      const key = keyOf(email);
      await db.transaction(async (tx) => {
        const [row] = await tx.select().from(signInThrottle).where(eq(signInThrottle.key, key)).for('update');
        if (!row || row.attempts === 0) return;
        const attempts = row.attempts - 1;
        const lock = lockSecondsAfter(attempts);
        await tx
          .update(signInThrottle)
          .set({ attempts, lockedUntil: lock ? new Date(row.lastAttemptAt.getTime() + lock * 1000) : null })
          .where(eq(signInThrottle.key, key));
      });
    },
    async succeeded(email: string) {
      await db.delete(signInThrottle).where(eq(signInThrottle.key, keyOf(email)));
    },
  };
}

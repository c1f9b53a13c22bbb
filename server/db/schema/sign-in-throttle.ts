import { pgTable, smallint, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * Password sign-in attempts per typed address (an HMAC of it, so addresses nobody has are not kept in the clear),
 * counted whether or not an account exists, so the lock tells nobody which addresses are real.
 */
export const signInThrottle = pgTable('sign_in_throttle', {
  key: text('key').primaryKey(),
  /** Attempts since the last successful sign-in (or since a quiet day). */
  attempts: smallint('attempts').notNull().default(0),
  lastAttemptAt: timestamp('last_attempt_at', { withTimezone: true }).notNull(),
  lockedUntil: timestamp('locked_until', { withTimezone: true }),
});

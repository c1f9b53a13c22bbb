import { index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { companies } from './companies';

export const IDEMPOTENCY_STATUSES = ['in_progress', 'done'] as const;
export const idempotencyStatus = pgEnum('idempotency_status', IDEMPOTENCY_STATUSES);

/**
 * One row per Idempotency-Key a member sent with a write ("The Idempotency-Key HTTP Header Field", IETF httpapi
 * draft): the request it was first used for, and once that succeeded, the answer a repeat gets back.
 */
export const idempotencyKeys = pgTable(
  'idempotency_keys',
  {
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    key: text('key').notNull(),
    method: text('method').notNull(),
    path: text('path').notNull(),
    /** SHA-256 (hex) of the method, path and canonical body: see server/lib/idempotency/fingerprint.ts. */
    fingerprint: text('fingerprint').notNull(),
    status: idempotencyStatus('status').notNull().default('in_progress'),
    responseStatus: integer('response_status'),
    responseBody: jsonb('response_body'),
    // Written from the app's clock, not now(), so the sweep and its test share one clock.
    createdAt: timestamp('created_at', { withTimezone: true }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.companyId, t.userId, t.key] }), index('idempotency_keys_created_idx').on(t.createdAt)],
);

import { sql } from 'drizzle-orm';
import { check, index, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { INVITATION_KINDS } from '../../../shared/schemas/invitations';
import { users } from './auth';
import { companies, memberRole } from './companies';
import { customers } from './records';
import { createdAt, id } from './columns';

export const invitationKind = pgEnum('invitation_kind', INVITATION_KINDS);

/**
 * An invitation to sign in by a one-time e-mail link. Accepting it (signed in with the invited address) creates the
 * membership, or links the homeowner account to the customer.
 */
export const invitations = pgTable(
  'invitations',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    kind: invitationKind('kind').notNull(),
    /** Stored lower-cased. */
    email: text('email').notNull(),
    role: memberRole('role'),
    customerId: uuid('customer_id').references(() => customers.id, { onDelete: 'cascade' }),
    invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    acceptedBy: uuid('accepted_by').references(() => users.id, { onDelete: 'set null' }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [
    index('invitations_email_idx').on(t.email),
    index('invitations_company_created_idx').on(t.companyId, t.createdAt.desc()),
    check('invitations_kind_target_ck', sql`(${t.kind} = 'member' AND ${t.role} IS NOT NULL AND ${t.customerId} IS NULL) OR (${t.kind} = 'homeowner' AND ${t.customerId} IS NOT NULL AND ${t.role} IS NULL)`),
  ],
);

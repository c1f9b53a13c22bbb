import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { companies } from './companies';
import { appliances } from './records';
import { createdAt, createdBy, id } from './columns';

/** A homeowner's capability link. Only the SHA-256 of its token is kept, so a leaked table opens nothing. */
export const shareLinks = pgTable(
  'share_links',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    applianceId: uuid('appliance_id')
      .notNull()
      .references(() => appliances.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    label: text('label'),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
    revokedBy: uuid('revoked_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    createdBy: createdBy(),
  },
  (t) => [index('share_links_appliance_idx').on(t.companyId, t.applianceId, t.createdAt)],
);

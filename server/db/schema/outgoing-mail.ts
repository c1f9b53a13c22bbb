import { sql } from 'drizzle-orm';
import { index, pgEnum, pgTable, smallint, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { MAIL_KINDS, MAIL_STATUSES } from '../../../shared/schemas/mail';
import { companies } from './companies';
import { createdAt, id } from './columns';

export const mailKind = pgEnum('mail_kind', MAIL_KINDS);
export const mailStatus = pgEnum('mail_status', MAIL_STATUSES);

/**
 * Every e-mail Lifeplate sends, kept until the mail server has taken it. The message itself is sealed (AES-256-GCM,
 * server/lib/sealed-box.ts), because a sign-in link in it is as good as a password, and emptied once sent.
 */
export const outgoingMail = pgTable(
  'outgoing_mail',
  {
    id: id(),
    /** Null for a plain sign-in link, which belongs to no company. */
    companyId: uuid('company_id').references(() => companies.id, { onDelete: 'cascade' }),
    kind: mailKind('kind').notNull(),
    /** The record the message is about: the invitation or the service request. */
    refId: uuid('ref_id'),
    status: mailStatus('status').notNull().default('queued'),
    sealed: text('sealed'),
    /** Tries claimed so far (a try is counted when it starts, so a crash mid-send still counts). */
    attempts: smallint('attempts').notNull().default(0),
    /** When a queued message is due, or when a claimed try counts as abandoned. */
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull(),
    lastError: text('last_error'),
    messageId: text('message_id'),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [
    index('outgoing_mail_due_idx').on(t.nextAttemptAt).where(sql`${t.status} in ('queued', 'sending')`),
    index('outgoing_mail_ref_idx').on(t.kind, t.refId, t.createdAt.desc()),
  ],
);

import { date, index, pgEnum, pgTable, smallint, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { REMINDER_KINDS, REMINDER_STATUSES, REMINDER_TRIGGERS } from '../../../shared/schemas/reminders';
import { users } from './auth';
import { companies } from './companies';
import { appliances, components, customers } from './records';
import { createdAt, id } from './columns';

export const reminderKind = pgEnum('reminder_kind', REMINDER_KINDS);
export const reminderStatus = pgEnum('reminder_status', REMINDER_STATUSES);
export const reminderTrigger = pgEnum('reminder_trigger', REMINDER_TRIGGERS);

/**
 * One row per reminder that was due, whether or not it could be sent. The unique key (appliance, kind, part, due period)
 * is what makes "never the same reminder twice" hold even when two senders race: the loser's insert does nothing.
 */
export const reminders = pgTable(
  'reminders',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    applianceId: uuid('appliance_id')
      .notNull()
      .references(() => appliances.id, { onDelete: 'cascade' }),
    customerId: uuid('customer_id')
      .notNull()
      .references(() => customers.id, { onDelete: 'cascade' }),
    kind: reminderKind('kind').notNull(),
    /** The component's id for a part-due reminder, '' for annual service (a plain column so it can be part of the key). */
    partKey: text('part_key').notNull().default(''),
    componentId: uuid('component_id').references(() => components.id, { onDelete: 'set null' }),
    partLabel: text('part_label'),
    /** The due date this reminder is about (ISO date): a new due date is a new period. */
    dueOn: date('due_on', { mode: 'string' }).notNull(),
    status: reminderStatus('status').notNull().default('pending'),
    trigger: reminderTrigger('trigger').notNull(),
    toEmail: text('to_email'),
    messageId: text('message_id'),
    attempts: smallint('attempts').notNull().default(0),
    lastError: text('last_error'),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    requestedBy: uuid('requested_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('reminders_once_per_period_uq').on(t.applianceId, t.kind, t.partKey, t.dueOn),
    index('reminders_company_created_idx').on(t.companyId, t.createdAt.desc()),
  ],
);

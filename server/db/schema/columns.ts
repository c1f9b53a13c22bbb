import { timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './auth';

export const id = () => uuid('id').defaultRandom().primaryKey();
export const createdAt = () => timestamp('created_at', { withTimezone: true }).defaultNow().notNull();
export const updatedAt = () =>
  timestamp('updated_at', { withTimezone: true })
    .defaultNow()
    .$onUpdate(() => new Date())
    .notNull();
export const createdBy = () => uuid('created_by').references(() => users.id, { onDelete: 'set null' });
export const updatedBy = () => uuid('updated_by').references(() => users.id, { onDelete: 'set null' });

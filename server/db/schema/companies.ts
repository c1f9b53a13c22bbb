import { sql } from 'drizzle-orm';
import { check, jsonb, pgEnum, pgTable, smallint, text, timestamp, uuid, uniqueIndex, index } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { createdAt, id, updatedAt } from './columns';
import { MEMBER_ROLES } from '../../../shared/schemas/roles';
import type { BookingMinutesSetting } from '../../../shared/schemas/bookings';

export const memberRole = pgEnum('member_role', MEMBER_ROLES);

export const companies = pgTable('companies', {
  id: id(),
  name: text('name').notNull(),
  phone: text('phone').notNull(),
  timeZone: text('time_zone').notNull().default('America/New_York'),
  /** How far below the nameplate input a clocked gas input may be before it is flagged; null: not judged. */
  underFiringTolerancePct: smallint('under_firing_tolerance_pct'),
  /** A new booking's window by appliance kind, in minutes (shared/schemas/bookings.ts DEFAULT_BOOKING_MINUTES when unset). */
  bookingMinutes: jsonb('booking_minutes').$type<Partial<BookingMinutesSetting>>().notNull().default({}),
  /** "Due soon" covers due dates from today through this many days ahead (shared/schemas/company.ts DUE_SOON_DAYS_*). */
  dueSoonDays: smallint('due_soon_days').notNull().default(60),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
}, (t) => [check('companies_due_soon_days_range', sql`${t.dueSoonDays} between 7 and 180`)]);

export const memberships = pgTable(
  'memberships',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: memberRole('role').notNull(),
    deactivatedAt: timestamp('deactivated_at', { withTimezone: true }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  // One company per user keeps "which tenant am I acting for" unambiguous.
  (t) => [uniqueIndex('memberships_user_uq').on(t.userId), index('memberships_company_idx').on(t.companyId)],
);

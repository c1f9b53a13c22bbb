import { sql } from 'drizzle-orm';
import { check, index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { BOOKING_SOURCES, BOOKING_STATUSES } from '../../../shared/schemas/bookings';
import { users } from './auth';
import { createdAt, createdBy, id, updatedAt, updatedBy } from './columns';
import { appliances, sites } from './records';
import { companies } from './companies';
import { serviceRequests } from './service-requests';

export const bookingStatus = pgEnum('booking_status', BOOKING_STATUSES);
export const bookingSource = pgEnum('booking_source', BOOKING_SOURCES);

/**
 * A visit planned for a window and a technician at one site. The window is stored as instants; the company's
 * wall-clock reading is derived from its time zone. `bookings_no_clash` (drizzle/0016_bookings_no_clash.sql, an
 * exclusion constraint over the technician and tstzrange(starts_at, ends_at), btree_gist) refuses two live
 * bookings of one technician that overlap; visits.booking_id points here (a foreign key added in that migration).
 */
export const bookings = pgTable(
  'bookings',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    siteId: uuid('site_id')
      .notNull()
      .references(() => sites.id, { onDelete: 'cascade' }),
    technicianId: uuid('technician_id')
      .notNull()
      .references(() => users.id, { onDelete: 'restrict' }),
    startsAt: timestamp('starts_at', { withTimezone: true }).notNull(),
    endsAt: timestamp('ends_at', { withTimezone: true }).notNull(),
    status: bookingStatus('status').notNull().default('booked'),
    source: bookingSource('source').notNull().default('phone'),
    serviceRequestId: uuid('service_request_id').references(() => serviceRequests.id, { onDelete: 'set null' }),
    note: text('note'),
    statusReason: text('status_reason'),
    /** Bumped on every change; the day-before reminder and the change e-mails are keyed by it. */
    revision: text('revision').notNull().default(sql`gen_random_uuid()::text`),
    /** Counts the changes (0 when booked, +1 with every change): the calendar invitation's SEQUENCE (RFC 5545, 3.8.7.4). */
    sequence: integer('sequence').notNull().default(0),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    createdBy: createdBy(),
    updatedBy: updatedBy(),
  },
  (t) => [
    index('bookings_company_start_idx').on(t.companyId, t.startsAt),
    index('bookings_technician_start_idx').on(t.technicianId, t.startsAt),
    index('bookings_site_idx').on(t.siteId),
    index('bookings_service_request_idx').on(t.serviceRequestId),
    check('bookings_window_ck', sql`${t.endsAt} > ${t.startsAt} and ${t.endsAt} - ${t.startsAt} <= interval '24 hours'`),
  ],
);

/** The appliances one booking covers (all at the booking's site; the service checks it). */
export const bookingAppliances = pgTable(
  'booking_appliances',
  {
    bookingId: uuid('booking_id')
      .notNull()
      .references(() => bookings.id, { onDelete: 'cascade' }),
    applianceId: uuid('appliance_id')
      .notNull()
      .references(() => appliances.id, { onDelete: 'cascade' }),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.bookingId, t.applianceId] }), index('booking_appliances_appliance_idx').on(t.applianceId)],
);

/** One row per booking change that owes the homeowner an e-mail, and per day-before reminder: the unique key makes each go once. */
export const bookingNotices = pgTable(
  'booking_notices',
  {
    bookingId: uuid('booking_id')
      .notNull()
      .references(() => bookings.id, { onDelete: 'cascade' }),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    /** booked | moved | cancelled | day_before */
    kind: text('kind').notNull(),
    /** The booking's revision the notice was for. */
    revision: text('revision').notNull(),
    mailId: uuid('mail_id'),
    /** sent (queued in outgoing_mail) | opted_out | no_email */
    outcome: text('outcome').notNull(),
    createdAt: createdAt(),
    data: jsonb('data').$type<Record<string, unknown>>().notNull().default({}),
  },
  (t) => [primaryKey({ columns: [t.bookingId, t.kind, t.revision] })],
);

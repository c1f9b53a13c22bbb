import { index, pgEnum, pgTable, text, timestamp, uuid, type AnyPgColumn } from 'drizzle-orm/pg-core';
import { SERVICE_REQUEST_STATUSES, SERVICE_REQUEST_VIAS } from '../../../shared/schemas/service-requests';
import { users } from './auth';
import { companies } from './companies';
import { appliances, customers } from './records';
import { shareLinks } from './share-links';
import { bookings } from './bookings';
import { createdAt, id, updatedAt } from './columns';

export const serviceRequestVia = pgEnum('service_request_via', SERVICE_REQUEST_VIAS);
export const serviceRequestStatus = pgEnum('service_request_status', SERVICE_REQUEST_STATUSES);

/** A homeowner asking to book a visit. Kept even if the e-mail to the office fails, so the office list never loses one. */
export const serviceRequests = pgTable(
  'service_requests',
  {
    id: id(),
    companyId: uuid('company_id')
      .notNull()
      .references(() => companies.id, { onDelete: 'cascade' }),
    applianceId: uuid('appliance_id')
      .notNull()
      .references(() => appliances.id, { onDelete: 'cascade' }),
    customerId: uuid('customer_id').references(() => customers.id, { onDelete: 'set null' }),
    via: serviceRequestVia('via').notNull(),
    shareLinkId: uuid('share_link_id').references(() => shareLinks.id, { onDelete: 'set null' }),
    requesterUserId: uuid('requester_user_id').references(() => users.id, { onDelete: 'set null' }),
    /** The booked visit a homeowner answered "this time does not suit me" to (via booking_reply). */
    aboutBookingId: uuid('about_booking_id').references((): AnyPgColumn => bookings.id, { onDelete: 'set null' }),
    contactName: text('contact_name').notNull(),
    contactPhone: text('contact_phone'),
    contactEmail: text('contact_email'),
    preferredTimes: text('preferred_times'),
    message: text('message'),
    status: serviceRequestStatus('status').notNull().default('new'),
    officeNotifiedAt: timestamp('office_notified_at', { withTimezone: true }),
    handledBy: uuid('handled_by').references(() => users.id, { onDelete: 'set null' }),
    handledAt: timestamp('handled_at', { withTimezone: true }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('service_requests_company_status_idx').on(t.companyId, t.status, t.createdAt.desc())],
);

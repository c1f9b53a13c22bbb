import { and, asc, eq, gte, inArray, lt, notExists, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { appliances, bookingAppliances, bookingNotices, bookings, companies, customers, sites, users } from '../../db/schema/index';
import type { BookingNoticeKind, BookingNoticeOutcome } from '../../../shared/schemas/booking-notices';

export const bookingNoticesRepository = {
  /** What one e-mail about a booking says: the window, the site, the customer, the technician and the appliances. */
  async context(db: DbOrTx, bookingId: string) {
    const [head] = await db
      .select({
        booking: bookings,
        street: sites.street,
        town: sites.town,
        postalCode: sites.postalCode,
        customerId: customers.id,
        customerName: customers.name,
        email: customers.email,
        optedOut: customers.remindersOptOut,
        companyName: companies.name,
        companyPhone: companies.phone,
        timeZone: companies.timeZone,
        technicianName: users.name,
      })
      .from(bookings)
      .innerJoin(sites, eq(sites.id, bookings.siteId))
      .innerJoin(customers, eq(customers.id, sites.customerId))
      .innerJoin(companies, eq(companies.id, bookings.companyId))
      .innerJoin(users, eq(users.id, bookings.technicianId))
      .where(eq(bookings.id, bookingId));
    if (!head) return null;
    const kinds = await db
      .select({ kind: appliances.kind, fuel: appliances.fuel })
      .from(bookingAppliances)
      .innerJoin(appliances, eq(appliances.id, bookingAppliances.applianceId))
      .where(eq(bookingAppliances.bookingId, bookingId))
      .orderBy(asc(appliances.kind));
    return { ...head, appliances: kinds };
  },

  /** The unique key (booking, kind, revision) is the guard: null when this notice was already recorded. */
  async claim(db: DbOrTx, row: { bookingId: string; companyId: string; kind: BookingNoticeKind; revision: string; outcome: BookingNoticeOutcome; data: Record<string, unknown> }) {
    const [inserted] = await db.insert(bookingNotices).values(row).onConflictDoNothing().returning();
    return inserted ?? null;
  },

  async setMail(db: DbOrTx, key: { bookingId: string; kind: BookingNoticeKind; revision: string }, mailId: string) {
    await db
      .update(bookingNotices)
      .set({ mailId })
      .where(and(eq(bookingNotices.bookingId, key.bookingId), eq(bookingNotices.kind, key.kind), eq(bookingNotices.revision, key.revision)));
  },

  /** Booked or confirmed bookings of one company starting in [from, to), for the day-before reminder. */
  startingBetween(db: DbOrTx, companyId: string, from: Date, to: Date) {
    return db
      .select({ id: bookings.id, revision: bookings.revision })
      .from(bookings)
      .where(and(eq(bookings.companyId, companyId), inArray(bookings.status, ['booked', 'confirmed']), gte(bookings.startsAt, from), lt(bookings.startsAt, to)))
      .orderBy(asc(bookings.startsAt));
  },

  /** Future live bookings of one company that no e-mail was ever recorded for (the demo seed writes bookings directly). */
  unannounced(db: DbOrTx, companyId: string, after: Date) {
    return db
      .select({ id: bookings.id })
      .from(bookings)
      .where(
        and(
          eq(bookings.companyId, companyId),
          inArray(bookings.status, ['booked', 'confirmed']),
          gte(bookings.startsAt, after),
          notExists(db.select({ one: sql`1` }).from(bookingNotices).where(eq(bookingNotices.bookingId, bookings.id))),
        ),
      )
      .orderBy(asc(bookings.startsAt));
  },
};

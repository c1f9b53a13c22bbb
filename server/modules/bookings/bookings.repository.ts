import { and, asc, eq, gt, inArray, isNull, lt, sql } from 'drizzle-orm';
import { duePartColumns, partsDueBy } from './due-parts';
import type { DbOrTx } from '../../db/client';
import { appliances, bookingAppliances, bookings, companies, components, memberships, serviceRequests, sites, users, visits } from '../../db/schema/index';

export type BookingRow = typeof bookings.$inferSelect;

export const bookingsRepository = {
  async company(db: DbOrTx, companyId: string) {
    const [row] = await db.select({ timeZone: companies.timeZone, bookingMinutes: companies.bookingMinutes }).from(companies).where(eq(companies.id, companyId));
    return row ?? null;
  },

  async activeTechnician(db: DbOrTx, companyId: string, userId: string) {
    const [row] = await db
      .select({ id: users.id, name: users.name, role: memberships.role })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.companyId, companyId), eq(memberships.userId, userId), isNull(memberships.deactivatedAt)));
    return row ?? null;
  },

  technicians(db: DbOrTx, companyId: string) {
    return db
      .select({ id: users.id, name: users.name })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.companyId, companyId), eq(memberships.role, 'technician'), isNull(memberships.deactivatedAt)))
      .orderBy(asc(users.name));
  },

  appliancesOf(db: DbOrTx, companyId: string, ids: string[]) {
    return db
      .select({ id: appliances.id, siteId: appliances.siteId, kind: appliances.kind })
      .from(appliances)
      .where(and(eq(appliances.companyId, companyId), inArray(appliances.id, ids)));
  },

  async insert(db: DbOrTx, row: typeof bookings.$inferInsert, applianceIds: string[]) {
    const [booking] = await db.insert(bookings).values(row).returning();
    await db.insert(bookingAppliances).values(applianceIds.map((applianceId) => ({ bookingId: booking.id, applianceId, companyId: booking.companyId })));
    return booking;
  },

  async find(db: DbOrTx, companyId: string, id: string, opts: { lock?: boolean } = {}) {
    const q = db.select().from(bookings).where(and(eq(bookings.companyId, companyId), eq(bookings.id, id)));
    const [row] = opts.lock ? await q.for('update') : await q;
    return row ?? null;
  },

  async update(db: DbOrTx, companyId: string, id: string, patch: Partial<typeof bookings.$inferInsert>) {
    const [row] = await db
      .update(bookings)
      .set({ ...patch, revision: sql`gen_random_uuid()::text`, sequence: sql`${bookings.sequence} + 1` })
      .where(and(eq(bookings.companyId, companyId), eq(bookings.id, id)))
      .returning();
    return row;
  },

  applianceIdsOf(db: DbOrTx, bookingId: string) {
    return db.select({ applianceId: bookingAppliances.applianceId }).from(bookingAppliances).where(eq(bookingAppliances.bookingId, bookingId));
  },

  /** Bookings overlapping [from, to), live or not, in start order. */
  inWindow(db: DbOrTx, companyId: string, from: Date, to: Date, technicianId?: string) {
    return db
      .select()
      .from(bookings)
      .where(
        and(
          eq(bookings.companyId, companyId),
          lt(bookings.startsAt, to),
          gt(bookings.endsAt, from),
          technicianId ? eq(bookings.technicianId, technicianId) : undefined,
        ),
      )
      .orderBy(asc(bookings.startsAt), asc(bookings.id));
  },

  /** A live booking of this technician overlapping the window, other than `exceptId`: named in the 409. */
  async clash(db: DbOrTx, technicianId: string, startsAt: Date, endsAt: Date, exceptId?: string) {
    const [row] = await db
      .select({ id: bookings.id, startsAt: bookings.startsAt, endsAt: bookings.endsAt, street: sites.street, town: sites.town })
      .from(bookings)
      .innerJoin(sites, eq(sites.id, bookings.siteId))
      .where(
        and(
          eq(bookings.technicianId, technicianId),
          inArray(bookings.status, ['booked', 'confirmed', 'done']),
          lt(bookings.startsAt, endsAt),
          gt(bookings.endsAt, startsAt),
          exceptId ? sql`${bookings.id} <> ${exceptId}` : undefined,
        ),
      )
      .limit(1);
    return row ?? null;
  },

  /**
   * Everything a booking card shows, for many bookings at once: five independent queries run side by side, each
   * keyed by one array parameter (`= any($1)`), so a week board of hundreds of bookings plans and runs quickly.
   */
  async details(db: DbOrTx, companyId: string, rows: Pick<BookingRow, 'id' | 'siteId' | 'technicianId' | 'createdBy'>[], dueBy: string) {
    if (!rows.length) return { heads: [], lines: [], parts: [], visitLinks: [] };
    const bookingIds = rows.map((r) => r.id);
    const siteIds = [...new Set(rows.map((r) => r.siteId))];
    const userIds = [...new Set(rows.flatMap((r) => [r.technicianId, r.createdBy]).filter((id): id is string => Boolean(id)))];
    const anyOf = (ids: string[]) => sql`any(${sql.param(ids)}::uuid[])`;
    const [siteRows, userRows, lines, parts, visitLinks] = await Promise.all([
      db
        .select({
          siteId: sites.id,
          street: sites.street,
          town: sites.town,
          postalCode: sites.postalCode,
          accessNotes: sites.accessNotes,
          customerId: sites.customerId,
          customerName: sql<string>`customer.name`,
          customerPhone: sql<string | null>`customer.phone`,
        })
        .from(sites)
        // A lateral lookup keeps this a few hundred index probes; a hash join would read every customer.
        .innerJoin(sql`lateral (select c.name, c.phone from customers c where c.id = ${sites.customerId} limit 1) customer`, sql`true`)
        .where(and(eq(sites.companyId, companyId), sql`${sites.id} = ${anyOf(siteIds)}`)),
      db.select({ id: users.id, name: users.name }).from(users).where(sql`${users.id} = ${anyOf(userIds)}`),
      db
        .select({
          bookingId: bookingAppliances.bookingId,
          applianceId: appliances.id,
          kind: appliances.kind,
          fuel: appliances.fuel,
          lastOutcome: sql<string | null>`last_visit.outcome`,
          lastVisitOn: sql<string | null>`last_visit.visited_on::text`,
        })
        .from(bookingAppliances)
        .innerJoin(appliances, eq(appliances.id, bookingAppliances.applianceId))
        .leftJoin(
          sql`lateral (select v.outcome, v.visited_on from visits v where v.appliance_id = ${appliances.id} and v.status = 'completed'
            order by v.visited_on desc, v.completed_at desc limit 1) last_visit`,
          sql`true`,
        )
        .where(and(eq(bookingAppliances.companyId, companyId), sql`${bookingAppliances.bookingId} = ${anyOf(bookingIds)}`)),
      db
        .selectDistinct({ id: components.id, ...duePartColumns })
        .from(components)
        .innerJoin(bookingAppliances, eq(bookingAppliances.applianceId, components.applianceId))
        .where(and(partsDueBy(companyId, dueBy), sql`${bookingAppliances.bookingId} = ${anyOf(bookingIds)}`))
        .orderBy(asc(components.dueOn), asc(components.id)),
      db
        .select({ bookingId: visits.bookingId, id: visits.id })
        .from(visits)
        .where(and(eq(visits.companyId, companyId), sql`${visits.bookingId} = ${anyOf(bookingIds)}`)),
    ]);
    const siteOf = new Map(siteRows.map((r) => [r.siteId, r]));
    const nameOf = new Map(userRows.map((u) => [u.id, u.name]));
    const heads = rows.flatMap((r) => {
      const site = siteOf.get(r.siteId);
      if (!site) return [];
      return [{ id: r.id, ...site, technicianName: nameOf.get(r.technicianId) ?? '', bookedByName: r.createdBy ? (nameOf.get(r.createdBy) ?? null) : null }];
    });
    return { heads, lines, parts, visitLinks };
  },

  /** A service request answered by a booking is scheduled; false when it is not this company's. */
  async claimServiceRequest(db: DbOrTx, companyId: string, id: string, actorId: string) {
    const rows = await db
      .update(serviceRequests)
      .set({ status: 'scheduled', handledBy: actorId, handledAt: new Date() })
      .where(and(eq(serviceRequests.companyId, companyId), eq(serviceRequests.id, id)))
      .returning({ id: serviceRequests.id });
    return rows.length > 0;
  },

  /** Marks a booking done when a visit started from it is completed (same transaction as the completion). */
  async markDone(db: DbOrTx, companyId: string, bookingId: string, actorId: string) {
    const [row] = await db
      .update(bookings)
      .set({ status: 'done', updatedBy: actorId, revision: sql`gen_random_uuid()::text` })
      .where(and(eq(bookings.companyId, companyId), eq(bookings.id, bookingId), inArray(bookings.status, ['booked', 'confirmed'])))
      .returning();
    return row ?? null;
  },

};

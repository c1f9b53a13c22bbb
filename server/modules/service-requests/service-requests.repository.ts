import { and, count, desc, eq, gte, inArray, isNull, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { appliances, customers, memberships, outgoingMail, serviceRequests, sites, users } from '../../db/schema/index';
import type { ServiceRequestStatus } from '../../../shared/schemas/service-requests';

export type ServiceRequestRow = typeof serviceRequests.$inferSelect;

const listColumns = {
  request: serviceRequests,
  // Text keeps PostgreSQL's microseconds, so the keyset never skips a row that a JS Date would round.
  createdAtKey: sql<string>`${serviceRequests.createdAt}::text`,
  handledByName: users.name,
  customerName: customers.name,
  applianceKind: appliances.kind,
  applianceFuel: appliances.fuel,
  street: sites.street,
  town: sites.town,
  officeMailStatus: outgoingMail.status,
  /** The live booking that answers the request, latest first ("id|starts_at" to keep one subquery). */
  booking: sql<string | null>`(select b.id::text || '|' || to_char(b.starts_at at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS"Z"') from bookings b
    where b.service_request_id = ${serviceRequests.id} and b.status in ('booked', 'confirmed', 'done') order by b.starts_at desc limit 1)`,
};
/** The office's e-mail about the request (one per request). */
const officeMail = and(eq(outgoingMail.kind, 'service_request'), eq(outgoingMail.refId, serviceRequests.id));

export const serviceRequestsRepository = {
  /** The appliance with its address and customer, within the company. */
  async applianceContext(db: DbOrTx, companyId: string, applianceId: string) {
    const [row] = await db
      .select({
        id: appliances.id,
        kind: appliances.kind,
        fuel: appliances.fuel,
        location: appliances.location,
        street: sites.street,
        town: sites.town,
        customerId: sites.customerId,
        customerName: customers.name,
      })
      .from(appliances)
      .innerJoin(sites, eq(sites.id, appliances.siteId))
      .leftJoin(customers, eq(customers.id, sites.customerId))
      .where(and(eq(appliances.companyId, companyId), eq(appliances.id, applianceId)));
    return row ?? null;
  },
  /** Serialises requests for one key (a share link or a homeowner) so two at once cannot both slip under the limit. */
  async lockFor(db: DbOrTx, key: string) {
    await db.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`service-request:${key}`}, 0))`);
  },
  async countSince(db: DbOrTx, by: { shareLinkId: string } | { requesterUserId: string } | { aboutBookingId: string }, since: Date) {
    const who =
      'shareLinkId' in by
        ? eq(serviceRequests.shareLinkId, by.shareLinkId)
        : 'requesterUserId' in by
          ? eq(serviceRequests.requesterUserId, by.requesterUserId)
          : eq(serviceRequests.aboutBookingId, by.aboutBookingId);
    const [row] = await db.select({ n: count() }).from(serviceRequests).where(and(who, gte(serviceRequests.createdAt, since)));
    return row?.n ?? 0;
  },
  async insert(db: DbOrTx, values: typeof serviceRequests.$inferInsert) {
    const [row] = await db.insert(serviceRequests).values(values).returning();
    return row;
  },
  /** The company has no office address: its active owners and managers hear about requests. */
  async officeRecipients(db: DbOrTx, companyId: string) {
    const rows = await db
      .select({ email: users.email })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.companyId, companyId), inArray(memberships.role, ['owner', 'manager']), isNull(memberships.deactivatedAt)))
      .orderBy(users.email);
    return rows.map((r) => r.email);
  },
  /** Newest first, keyset on (created_at, id). */
  list(db: DbOrTx, companyId: string, q: { status?: ServiceRequestStatus; after?: { createdAt: string; id: string }; limit: number }) {
    return db
      .select(listColumns)
      .from(serviceRequests)
      .innerJoin(appliances, eq(appliances.id, serviceRequests.applianceId))
      .innerJoin(sites, eq(sites.id, appliances.siteId))
      .leftJoin(customers, eq(customers.id, serviceRequests.customerId))
      .leftJoin(users, eq(users.id, serviceRequests.handledBy))
      .leftJoin(outgoingMail, officeMail)
      .where(
        and(
          eq(serviceRequests.companyId, companyId),
          q.status ? eq(serviceRequests.status, q.status) : undefined,
          q.after ? sql`(${serviceRequests.createdAt}, ${serviceRequests.id}) < (${q.after.createdAt}::timestamptz, ${q.after.id}::uuid)` : undefined,
        ),
      )
      .orderBy(desc(serviceRequests.createdAt), desc(serviceRequests.id))
      .limit(q.limit);
  },
  async findListed(db: DbOrTx, companyId: string, id: string) {
    const [row] = await db
      .select(listColumns)
      .from(serviceRequests)
      .innerJoin(appliances, eq(appliances.id, serviceRequests.applianceId))
      .innerJoin(sites, eq(sites.id, appliances.siteId))
      .leftJoin(customers, eq(customers.id, serviceRequests.customerId))
      .leftJoin(users, eq(users.id, serviceRequests.handledBy))
      .leftJoin(outgoingMail, officeMail)
      .where(and(eq(serviceRequests.companyId, companyId), eq(serviceRequests.id, id)));
    return row ?? null;
  },
  async countNew(db: DbOrTx, companyId: string) {
    const [row] = await db
      .select({ n: count() })
      .from(serviceRequests)
      .where(and(eq(serviceRequests.companyId, companyId), eq(serviceRequests.status, 'new')));
    return row?.n ?? 0;
  },
  async find(db: DbOrTx, companyId: string, id: string) {
    const [row] = await db.select().from(serviceRequests).where(and(eq(serviceRequests.companyId, companyId), eq(serviceRequests.id, id)));
    return row ?? null;
  },
  async setStatus(db: DbOrTx, companyId: string, id: string, values: { status: ServiceRequestStatus; handledBy: string; handledAt: Date }) {
    const [row] = await db
      .update(serviceRequests)
      .set(values)
      .where(and(eq(serviceRequests.companyId, companyId), eq(serviceRequests.id, id)))
      .returning();
    return row ?? null;
  },
};

export type ListedServiceRequest = NonNullable<Awaited<ReturnType<typeof serviceRequestsRepository.findListed>>>;

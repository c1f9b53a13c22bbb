import { and, asc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { appliances, sites } from '../schema/index';
import { insertBooking } from '../factories/bookings';
import { addDays } from '../../../shared/trade/iso-date';
import { DEFAULT_BOOKING_MINUTES } from '../../../shared/schemas/bookings';
import type { DemoClock } from './demo-clock';

const SLOTS = [9, 13] as const;
const isWeekday = (date: string) => ![0, 6].includes(new Date(`${date}T12:00:00Z`).getUTCDay());

/**
 * An autumn's plan: the next two working weeks on both technicians' rounds, two bookings a day each, the first days
 * confirmed, one cancelled; yesterday's no-access visit for the office to rebook. Plans lie ahead of `now` by nature;
 * everything that has happened (the no-access) lies before it.
 */
export async function seedDemoBookings(db: DbOrTx, opts: { companyId: string; technicianIds: string[]; managerId: string; clock: DemoClock }) {
  const { companyId, technicianIds, managerId, clock } = opts;
  const rows = await db
    .select({ id: appliances.id, siteId: appliances.siteId, kind: appliances.kind })
    .from(appliances)
    .innerJoin(sites, eq(sites.id, appliances.siteId))
    .where(and(eq(appliances.companyId, companyId), eq(appliances.status, 'in_service')))
    .orderBy(asc(sites.town), asc(sites.street), asc(appliances.id));
  const bySite = new Map<string, typeof rows>();
  for (const r of rows) bySite.set(r.siteId, [...(bySite.get(r.siteId) ?? []), r]);
  const visitsToPlan = [...bySite.values()];

  const days: string[] = [];
  for (let d = clock.today; days.length < 10; d = addDays(d, 1)) if (isWeekday(d)) days.push(d);

  let n = 0;
  for (const day of days) {
    for (const technicianId of technicianIds) {
      for (const hour of SLOTS) {
        const site = visitsToPlan[n % visitsToPlan.length];
        const minutes = Math.max(...site.map((a) => DEFAULT_BOOKING_MINUTES[a.kind]));
        const startsAt = clock.at(day, hour);
        n += 1;
        const status = n === 7 ? 'cancelled' : n <= 6 ? 'confirmed' : 'booked';
        await insertBooking(db, {
          companyId,
          siteId: site[0].siteId,
          technicianId,
          applianceIds: site.map((a) => a.id),
          startsAt,
          endsAt: new Date(startsAt.getTime() + minutes * 60_000),
          status,
          statusReason: status === 'cancelled' ? 'Customer away until the new year' : null,
          source: n % 3 === 0 ? 'phone' : 'annual_service',
          createdBy: managerId,
          updatedBy: managerId,
        });
      }
    }
  }
  // Yesterday (or the last weekday): nobody home.
  let past = addDays(clock.today, -1);
  while (!isWeekday(past)) past = addDays(past, -1);
  const site = visitsToPlan[n % visitsToPlan.length];
  await insertBooking(db, {
    companyId,
    siteId: site[0].siteId,
    technicianId: technicianIds[0],
    applianceIds: site.map((a) => a.id),
    startsAt: clock.at(past, 10),
    endsAt: clock.at(past, 11, 30),
    status: 'no_access',
    statusReason: 'Nobody home; card left at the door',
    source: 'phone',
    createdBy: managerId,
    updatedBy: managerId,
  });
}

import type { LoadStep } from './load-records';

/** Weeks of bookings either side of the data set's today, as a company in its busy season holds them. */
export const BOOKING_WEEKS_EACH_SIDE = 8;
/** Four 90-minute windows a working day per technician (company wall-clock time). */
const SLOTS = `(values (1, time '08:00'), (2, time '10:00'), (3, time '12:30'), (4, time '14:30')) s(slot, start_time)`;

/**
 * Bookings for every technician of the large company on every working day from 8 weeks back to 8 weeks ahead:
 * past ones mostly done (some no access or cancelled), coming ones booked or confirmed (a few cancelled).
 * Each covers one appliance at its site. Slots never overlap, so the no-clash constraint holds by construction.
 */
export function bookingSteps(opts: { today: string; timeZone: string }): LoadStep[] {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(opts.today)) throw new Error(`today must be YYYY-MM-DD, got ${opts.today}`);
  const today = `'${opts.today}'::date`;
  const days = BOOKING_WEEKS_EACH_SIDE * 7;
  return [
    {
      name: 'bookings',
      sql: `
        create temp table bench_bk as
        select pg_temp.uid('0:bk:' || t.i || ':' || d.day || ':' || s.slot) as id, co.id as company_id, co.techs[t.i] as tech, d.day, s.start_time,
          pg_temp.between_int(1, co.n_app, '0:bka:' || t.i || ':' || d.day || ':' || s.slot) as n
        from bench_co co
        cross join lateral generate_series(1, cardinality(co.techs)) t(i)
        cross join lateral (select (${today} + g)::date as day from generate_series(-${days}, ${days}) g) d
        cross join ${SLOTS}
        where co.k = 0 and extract(isodow from d.day) < 6;
        insert into bookings (id, company_id, site_id, technician_id, starts_at, ends_at, status, source, created_by, updated_by)
        select b.id, b.company_id, a.site_id, b.tech, (b.day + b.start_time) at time zone $1, (b.day + b.start_time + interval '90 minutes') at time zone $1,
          (case when b.day < ${today} then (case when x.h < 0.9 then 'done' when x.h < 0.95 then 'no_access' else 'cancelled' end)
                else (case when x.h < 0.05 then 'cancelled' when b.day < ${today} + 14 and x.h < 0.6 then 'confirmed' else 'booked' end) end)::booking_status,
          (case when x.h2 < 0.6 then 'due_list' when x.h2 < 0.85 then 'annual_service' else 'phone' end)::booking_source, b.tech, b.tech
        from bench_bk b
        join bench_app a on a.k = 0 and a.n = b.n
        cross join lateral (select pg_temp.h(b.id::text) as h, pg_temp.h(b.id::text || ':src') as h2) x;
        insert into booking_appliances (booking_id, appliance_id, company_id)
        select b.id, a.id, b.company_id from bench_bk b join bench_app a on a.k = 0 and a.n = b.n`,
      params: [opts.timeZone],
    },
  ];
}

import pg from 'pg';
import { addDays } from '../../shared/trade/iso-date';
import { todayInTimeZone } from '../../shared/dates';
import { BOOKING_WEEKS_EACH_SIDE } from '../data/load-bookings';
import type { BenchFigure } from '../lib/figure';
import type { AppRun } from './app-figures';
import { pick } from './load';
import { latencyAt, median, percentileRow, round, type Scale } from './measure';

type BookingSamples = { technicianIds: string[]; applianceIds: string[]; timeZone: string };

async function bookingSamples(run: AppRun): Promise<BookingSamples> {
  const pool = new pg.Pool({ connectionString: run.databaseUrl, max: 1 });
  try {
    const companyId = run.meta.companyId;
    const technicianIds = (
      await pool.query<{ id: string }>(`select user_id as id from memberships where company_id = $1 and role = 'technician' and deactivated_at is null order by user_id`, [companyId])
    ).rows.map((r) => r.id);
    // One appliance per site, so each booking's appliances are at one site.
    const applianceIds = (
      await pool.query<{ id: string }>(`select distinct on (site_id) id from appliances where company_id = $1 and status = 'in_service' order by site_id, id limit 2000`, [companyId])
    ).rows.map((r) => r.id);
    const [{ time_zone: timeZone }] = (await pool.query<{ time_zone: string }>('select time_zone from companies where id = $1', [companyId])).rows;
    return { technicianIds, applianceIds, timeZone };
  } finally {
    await pool.end();
  }
}

/** Monday of the ISO week holding `iso`. */
const mondayOf = (iso: string) => addDays(iso, -((new Date(`${iso}T12:00:00Z`).getUTCDay() + 6) % 7));

/** A random working day within the generated bookings (Monday to Friday). */
function workingDayNear(today: string) {
  const span = BOOKING_WEEKS_EACH_SIDE - 1;
  return addDays(mondayOf(addDays(today, 7 * (Math.floor(Math.random() * (2 * span + 1)) - span))), Math.floor(Math.random() * 5));
}

/**
 * The week board (every technician's week), a technician's round with its load list, and a booking's insert with
 * the no-clash check. The inserts go after the generated weeks at 17:00 on distinct (technician, day) pairs, and
 * are deleted afterwards so the data set stays as generated.
 */
export async function bookingRows(run: AppRun, scale: Scale): Promise<BenchFigure[]> {
  const s = await bookingSamples(run);
  const dataToday = run.meta.today;
  const board = await latencyAt(scale, run.baseUrl, run.cookie, () => {
    const monday = mondayOf(workingDayNear(dataToday));
    return `/api/bookings?from=${monday}&to=${addDays(monday, 6)}`;
  }, 20);
  const roundLoad = await latencyAt(scale, run.baseUrl, run.cookie, () => `/api/rounds?date=${workingDayNear(dataToday)}&technicianId=${pick(s.technicianIds)}`, 50);

  const inserts = scale.quick ? 5 : 200;
  const first = addDays(todayInTimeZone(s.timeZone), BOOKING_WEEKS_EACH_SIDE * 7 + 14);
  const times: number[] = [];
  const made: string[] = [];
  let failed = 0;
  try {
    for (let i = 0; i < inserts; i++) {
      const day = addDays(first, Math.floor(i / s.technicianIds.length));
      const body = {
        applianceIds: [s.applianceIds[i % s.applianceIds.length]],
        technicianId: s.technicianIds[i % s.technicianIds.length],
        start: `${day}T17:00`,
        end: `${day}T18:00`,
        source: 'due_list',
      };
      const started = performance.now();
      const res = await fetch(`${run.baseUrl}/api/bookings`, {
        method: 'POST',
        headers: { cookie: run.cookie, 'content-type': 'application/json', origin: run.baseUrl, accept: 'application/json' },
        body: JSON.stringify(body),
      });
      times.push(performance.now() - started);
      const json = (await res.json()) as { id?: string };
      if (res.status === 201 && json.id) made.push(json.id);
      else failed++;
    }
  } finally {
    await deleteBookings(run.databaseUrl, made);
  }
  const p50 = round(median(times), 1);
  return [
    percentileRow(`Week board, ${s.technicianIds.length} technicians: p99`, '20 req/s, random week of the 16', board, 100),
    percentileRow('Round with its load list: p99', '50 req/s, random technician and day', roundLoad, 50),
    {
      figure: 'Booking (insert with the no-clash check): p50',
      load: 'one at a time',
      value: p50,
      unit: 'ms',
      target: 'p50 ≤ 20 ms',
      met: failed === 0 && p50 <= 20,
      note: [`${inserts} bookings, slowest ${round(Math.max(...times), 1)} ms`, failed ? `${failed} not created` : ''].filter(Boolean).join('; '),
    },
  ];
}

async function deleteBookings(databaseUrl: string, ids: string[]) {
  if (!ids.length) return;
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 1 });
  try {
    await pool.query('delete from timeline_events where ref_id = any($1::uuid[])', [ids]);
    await pool.query('delete from bookings where id = any($1::uuid[])', [ids]);
  } finally {
    await pool.end();
  }
}

import { and, asc, inArray, sql, type SQL } from 'drizzle-orm';
import { components } from '../../db/schema/index';
import { duePartColumns, partsDueBy } from './due-parts';
import type { DbOrTx } from '../../db/client';
import type { ApplianceKind, Fuel } from '../../../shared/schemas/enums';

export type UnbookedFilter = {
  companyId: string;
  /** Due on or before this date (the window's last day). */
  through: string;
  today: string;
  /** A live booking ending after this instant still covers the appliance. */
  now: Date;
  applianceKind?: ApplianceKind;
  fuel?: Fuel;
  town?: string;
  search?: string;
  technicianId?: string;
  after?: { firstDueOn: string; id: string } | null;
  limit: number;
};

type UnbookedRow = {
  appliance_id: string;
  kind: ApplianceKind;
  fuel: Fuel;
  site_id: string;
  street: string;
  town: string;
  assigned_technician_id: string | null;
  assigned_technician_name: string | null;
  customer_id: string;
  customer_name: string;
  first_due_on: string;
};

const likePattern = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/**
 * Appliances with a present part due by `through` (or failed at the last check) and no booked or confirmed
 * booking that has not ended yet, read from the stored due state the due list reads; keyset on (first due, id).
 */
export async function listUnbooked(db: DbOrTx, q: UnbookedFilter): Promise<UnbookedRow[]> {
  const filters: SQL[] = [];
  if (q.applianceKind) filters.push(sql`and a.kind = ${q.applianceKind}`);
  if (q.fuel) filters.push(sql`and a.fuel = ${q.fuel}`);
  if (q.town) filters.push(sql`and lower(s.town) = lower(${q.town})`);
  if (q.technicianId) filters.push(sql`and s.assigned_technician_id = ${q.technicianId}`);
  if (q.search) {
    const like = likePattern(q.search);
    filters.push(sql`and (cu.name ilike ${like} or s.street ilike ${like} or s.town ilike ${like})`);
  }
  const having = q.after
    ? sql`having (min(case when c.condition_failed then least(c.due_on, ${q.today}::date) else c.due_on end), a.id) > (${q.after.firstDueOn}::date, ${q.after.id}::uuid)`
    : sql``;
  const result = await db.execute<UnbookedRow>(sql`
    select a.id as appliance_id, a.kind, a.fuel, s.id as site_id, s.street, s.town,
           s.assigned_technician_id, u.name as assigned_technician_name, cu.id as customer_id, cu.name as customer_name,
           min(case when c.condition_failed then least(c.due_on, ${q.today}::date) else c.due_on end)::text as first_due_on
    from components c
    join appliances a on a.id = c.appliance_id and a.company_id = c.company_id
    join sites s on s.id = a.site_id
    join customers cu on cu.id = s.customer_id
    left join users u on u.id = s.assigned_technician_id
    where c.company_id = ${q.companyId}
      and c.removed_on is null
      and a.status <> 'removed'
      and (c.condition_failed or c.due_on <= ${q.through}::date)
      and not exists (
        select 1 from booking_appliances ba join bookings b on b.id = ba.booking_id
        where ba.company_id = ${q.companyId} and ba.appliance_id = a.id
          and b.status in ('booked', 'confirmed') and b.ends_at > ${q.now.toISOString()}::timestamptz
      )
      ${sql.join(filters, sql` `)}
    group by a.id, a.kind, a.fuel, s.id, s.street, s.town, s.assigned_technician_id, u.name, cu.id, cu.name
    ${having}
    order by 11, a.id
    limit ${q.limit}
  `);
  return result.rows;
}

/** The due parts of these appliances, worded as a booking card words them. */
export function duePartsOf(db: DbOrTx, companyId: string, applianceIds: string[], through: string) {
  return db
    .select(duePartColumns)
    .from(components)
    .where(and(partsDueBy(companyId, through), inArray(components.applianceId, applianceIds)))
    .orderBy(asc(components.dueOn));
}

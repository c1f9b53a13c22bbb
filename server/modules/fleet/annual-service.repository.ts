import { sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';

type Row = {
  appliance_id: string;
  kind: string;
  fuel: string;
  manufacturer: string | null;
  model: string | null;
  street: string;
  town: string;
  last_annual_on: string | null;
  customer_id: string;
  name: string;
  phone: string | null;
  email: string | null;
  reminders_opt_out: boolean;
  total: number;
};

/** In-service appliances with no completed annual maintenance since `cutoff` (exclusive), never-serviced first. */
export async function findAnnualServiceDue(db: DbOrTx, companyId: string, cutoff: string, limit: number) {
  const result = await db.execute<Row>(sql`
    select a.id as appliance_id, a.kind, a.fuel, a.manufacturer, a.model, s.street, s.town,
           la.last_annual_on::text as last_annual_on,
           c.id as customer_id, c.name, c.phone, c.email, c.reminders_opt_out,
           count(*) over ()::int as total
    from appliances a
    join sites s on s.id = a.site_id and s.company_id = a.company_id
    join customers c on c.id = s.customer_id and c.company_id = a.company_id
    left join lateral (
      select max(v.visited_on) as last_annual_on
      from visits v
      where v.appliance_id = a.id and v.company_id = a.company_id and v.status = 'completed' and v.type = 'annual_maintenance'
    ) la on true
    where a.company_id = ${companyId} and a.status = 'in_service'
      and (la.last_annual_on is null or la.last_annual_on <= ${cutoff}::date)
    order by la.last_annual_on asc nulls first, a.id
    limit ${limit}
  `);
  return result.rows;
}

import { sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { APPLIANCE_KINDS, CONSTRUCTIONS } from '../../../shared/schemas/enums';
import { medianServiceLifeYears } from '../../../shared/trade/service-life';

/** The ASHRAE medians as SQL rows, built from shared/trade so the table is written down in one place only. */
function mediansValues() {
  const rows = APPLIANCE_KINDS.flatMap((kind) =>
    CONSTRUCTIONS.map((construction) => ({ kind, construction, years: medianServiceLifeYears({ kind, construction }).years })),
  ).filter((r) => r.years !== null);
  return sql.join(
    rows.map((r) => sql`(${r.kind}, ${r.construction}, ${r.years}::int)`),
    sql`, `,
  );
}

type Row = {
  appliance_id: string;
  kind: string;
  fuel: string;
  construction: string;
  manufacturer: string | null;
  model: string | null;
  street: string;
  town: string;
  customer_name: string;
  age_from: string;
  median_years: number;
  combustion: { efficiencyPct?: number | null; coAirFreePpm?: number } | null;
  combustion_on: string | null;
};

/** In-service appliances within `nearYears` of their published median life, or past it; oldest first. */
export async function findReplacementProspects(db: DbOrTx, companyId: string, today: string, nearYears: number, limit: number) {
  const result = await db.execute<Row>(sql`
    with medians(kind, construction, years) as (values ${mediansValues()}),
    aged as (
      select a.*, coalesce(a.installed_on, make_date(a.manufactured_year, coalesce(a.manufactured_month, 1), 1)) as age_from
      from appliances a
      where a.company_id = ${companyId} and a.status = 'in_service'
    )
    select a.id as appliance_id, a.kind, a.fuel, a.construction, a.manufacturer, a.model, s.street, s.town, c.name as customer_name,
           a.age_from::text as age_from, m.years as median_years, lc.combustion, lc.visited_on::text as combustion_on
    from aged a
    join medians m on m.kind = a.kind::text and m.construction = a.construction::text
    join sites s on s.id = a.site_id and s.company_id = a.company_id
    join customers c on c.id = s.customer_id and c.company_id = a.company_id
    left join lateral (
      select v.results -> 'combustion' as combustion, v.visited_on
      from visits v
      where v.appliance_id = a.id and v.company_id = a.company_id and v.status = 'completed' and v.results ? 'combustion'
      order by v.visited_on desc
      limit 1
    ) lc on true
    where a.age_from is not null and a.age_from <= (${today}::date - make_interval(years => greatest(m.years - ${nearYears}, 0)))
    order by a.age_from asc, a.id
    limit ${limit}
  `);
  return result.rows;
}

import { sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';

export type AgeCountRow = { type_code: string; days: number; event: boolean; n: number; first_on: string | null; last_on: string | null };

/**
 * Per part type and age in days, how many parts ended their service life there (event) and how many were last seen
 * there (censored), in one GROUP BY. Age runs from the part's install date (else the appliance's) to its removal,
 * or to `today` while it is in service. Which removals are events: shared/stats/swap-causes.ts.
 */
export async function serviceLifeCounts(db: DbOrTx, companyId: string, today: string, typeCode?: string) {
  const result = await db.execute<AgeCountRow>(sql`
    with obs as (
      select
        c.type_code,
        coalesce(c.removed_on, ${today}::date) - coalesce(c.installed_on, a.installed_on) as days,
        coalesce(ps.cause = 'wear_or_failure', false) as event,
        ps.swapped_on
      from components c
      join appliances a on a.id = c.appliance_id and a.company_id = c.company_id
      left join part_swaps ps on ps.company_id = c.company_id and ps.removed_component_id = c.id
      where c.company_id = ${companyId}
        ${typeCode ? sql`and c.type_code = ${typeCode}` : sql``}
        and coalesce(c.installed_on, a.installed_on) is not null
    )
    select type_code, days, event, count(*)::int as n,
      min(swapped_on) filter (where event)::text as first_on,
      max(swapped_on) filter (where event)::text as last_on
    from obs
    where days >= 0
    group by type_code, days, event
  `);
  return result.rows;
}

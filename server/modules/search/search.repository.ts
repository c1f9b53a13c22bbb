import { sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import type { ApplianceKind, ApplianceStatus, Fuel } from '../../../shared/schemas/enums';
import type { SearchHit } from '../../../shared/schemas/records';
import { escapeLike } from '../../lib/like';

export type SearchRow = {
  appliance_id: string;
  kind: ApplianceKind;
  fuel: Fuel;
  manufacturer: string | null;
  model: string | null;
  serial: string | null;
  status: ApplianceStatus;
  customer_name: string;
  street: string;
  town: string;
  matched: SearchHit['matched'];
};

export const SEARCH_LIMIT = 20;

/**
 * Appliances whose customer name, street, phone or serial contains the text. Each source is its own branch so
 * the trigram GIN indexes on name, street and serial serve the ILIKE '%…%'; a prefix match (of the field or of a
 * word in it) ranks first, and removed appliances rank last. One row per appliance: its best match.
 */
export async function searchAppliances(db: DbOrTx, companyId: string, text: string): Promise<SearchRow[]> {
  const contains = `%${escapeLike(text)}%`;
  const prefix = `${escapeLike(text)}%`;
  const wordPrefix = `% ${escapeLike(text)}%`;
  const digits = text.replace(/\D/g, '');
  // Phones are written many ways; with enough digits typed, compare digits only.
  const phoneMatch =
    digits.length >= 3
      ? sql`regexp_replace(c.phone, '\\D', '', 'g') like ${`%${digits}%`}`
      : sql`c.phone ilike ${contains}`;
  // Text without a digit cannot be part of a phone number; skipping the branch saves a scan of every customer.
  const phoneBranch = digits.length
    ? sql`
      union all
      select a.id, 'phone', true, 3
        from customers c
        join sites s on s.customer_id = c.id and s.company_id = c.company_id
        join appliances a on a.site_id = s.id and a.company_id = s.company_id
        where c.company_id = ${companyId} and c.phone is not null and ${phoneMatch}`
    : sql``;
  const result = await db.execute<SearchRow>(sql`
    with hits as (
      select a.id as appliance_id, 'serial' as matched, (a.serial ilike ${prefix}) as is_prefix, 0 as source_rank
        from appliances a where a.company_id = ${companyId} and a.serial ilike ${contains}
      union all
      select a.id, 'name', (c.name ilike ${prefix} or c.name ilike ${wordPrefix}), 1
        from customers c
        join sites s on s.customer_id = c.id and s.company_id = c.company_id
        join appliances a on a.site_id = s.id and a.company_id = s.company_id
        where c.company_id = ${companyId} and c.name ilike ${contains}
      union all
      select a.id, 'street', (s.street ilike ${prefix} or s.street ilike ${wordPrefix}), 2
        from sites s
        join appliances a on a.site_id = s.id and a.company_id = s.company_id
        where s.company_id = ${companyId} and s.street ilike ${contains}
      ${phoneBranch}
    ),
    best as (
      select distinct on (appliance_id) appliance_id, matched, is_prefix
        from hits order by appliance_id, is_prefix desc, source_rank
    )
    select b.appliance_id, b.matched, a.kind, a.fuel, a.manufacturer, a.model, a.serial, a.status,
           c.name as customer_name, s.street, s.town
      from best b
      join appliances a on a.id = b.appliance_id
      join sites s on s.id = a.site_id
      join customers c on c.id = s.customer_id
      order by (a.status = 'removed'), b.is_prefix desc, c.name, s.street, a.installed_on desc nulls last, a.id
      limit ${SEARCH_LIMIT}
  `);
  return result.rows;
}

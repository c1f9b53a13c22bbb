import { sql, type SQL } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';

export type ChangeRow = {
  id: string;
  at: Date;
  action: string;
  entity: string;
  entity_id: string;
  changes: Record<string, unknown> | null;
  who: string | null;
  visit_id: string | null;
  visited_on: string | null;
};
export type VisitOriginal = {
  id: string;
  outcome: string | null;
  outcome_reason: string | null;
  findings: string;
  recommendations: string;
  readings: Record<string, unknown>;
};

/** Rows about one appliance: the record itself, its parts, its visits and their swaps, its bookings, and what names it in its changes. */
const aboutAppliance = (companyId: string, applianceId: string) => sql`
  (l.entity = 'appliance' and l.entity_id = ${applianceId}::text)
  or (l.entity = 'component' and l.entity_id in (select id::text from components where company_id = ${companyId} and appliance_id = ${applianceId}))
  or (l.entity = 'visit' and l.entity_id in (select id::text from visits where company_id = ${companyId} and appliance_id = ${applianceId}))
  or (l.entity = 'part_swap' and l.changes->>'visitId' in (select id::text from visits where company_id = ${companyId} and appliance_id = ${applianceId}))
  or (l.entity = 'makeup_water_entry' and l.entity_id in (select id::text from makeup_water_entries where company_id = ${companyId} and appliance_id = ${applianceId}))
  or (l.entity <> 'appliance' and l.changes->>'applianceId' = ${applianceId}::text)
  or (l.entity = 'booking' and jsonb_exists(l.changes->'applianceIds', ${applianceId}::text))`;

/** Rows about one visit: the visit's own and the part swaps recorded on it. */
const aboutVisit = (visitId: string) => sql`
  (l.entity = 'visit' and l.entity_id = ${visitId}::text)
  or (l.entity = 'part_swap' and l.changes->>'visitId' = ${visitId}::text)`;

/** Newest first, keyset on (created_at, id); the cursor is the last row's id, looked up again within the company. */
async function page(db: DbOrTx, companyId: string, about: SQL, q: { limit: number; cursor?: string }) {
  const after = q.cursor
    ? sql`and (l.created_at, l.id) < (select c.created_at, c.id from audit_log c where c.company_id = ${companyId} and c.id = ${q.cursor}::bigint)`
    : sql``;
  const result = await db.execute<ChangeRow>(sql`
    select l.id::text as id, l.created_at as at, l.action, l.entity, l.entity_id, l.changes, u.name as who,
      v.id::text as visit_id, v.visited_on::text as visited_on
    from audit_log l
    left join users u on u.id = l.actor_id
    left join visits v on v.company_id = l.company_id
      and v.id::text = (case when l.entity = 'visit' then l.entity_id else l.changes->>'visitId' end)
    where l.company_id = ${companyId} and (${about}) ${after}
    order by l.created_at desc, l.id desc
    limit ${q.limit + 1}`);
  const rows = result.rows.map((r) => ({ ...r, at: new Date(r.at) }));
  const items = rows.slice(0, q.limit);
  return { items, nextCursor: rows.length > q.limit ? items[items.length - 1]!.id : null };
}

export const changesRepository = {
  applianceExists: async (db: DbOrTx, companyId: string, applianceId: string) =>
    (await db.execute(sql`select 1 from appliances where company_id = ${companyId} and id = ${applianceId}`)).rows.length > 0,
  visitExists: async (db: DbOrTx, companyId: string, visitId: string) =>
    (await db.execute(sql`select 1 from visits where company_id = ${companyId} and id = ${visitId}`)).rows.length > 0,
  ofAppliance: (db: DbOrTx, companyId: string, applianceId: string, q: { limit: number; cursor?: string }) => page(db, companyId, aboutAppliance(companyId, applianceId), q),
  ofVisit: (db: DbOrTx, companyId: string, visitId: string, q: { limit: number; cursor?: string }) => page(db, companyId, aboutVisit(visitId), q),
  /** The visits' signed-off values, which amendments never overwrite (server/modules/visits/visit-amendments.ts). */
  async visitOriginals(db: DbOrTx, companyId: string, visitIds: string[]) {
    if (!visitIds.length) return [];
    const result = await db.execute<VisitOriginal>(sql`
      select id::text as id, outcome, outcome_reason, findings, recommendations, readings
      from visits where company_id = ${companyId} and id::text = any(${sql.param(visitIds)}::text[])`);
    return result.rows;
  },
  /** Every amendment of those visits, oldest first, so each can be told against the one before. */
  async amendmentsOf(db: DbOrTx, companyId: string, visitIds: string[]) {
    if (!visitIds.length) return [];
    const result = await db.execute<{ id: string; entity_id: string; changes: Record<string, unknown> | null }>(sql`
      select id::text as id, entity_id, changes from audit_log
      where company_id = ${companyId} and entity = 'visit' and action = 'amend' and entity_id = any(${sql.param(visitIds)}::text[])
      order by created_at, id`);
    return result.rows;
  },
};

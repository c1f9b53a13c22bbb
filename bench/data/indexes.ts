import type pg from 'pg';

export const LOADED_TABLES = ['customers', 'sites', 'appliances', 'components', 'visits', 'part_swaps', 'timeline_events', 'photos', 'tags', 'bookings', 'booking_appliances'];

/**
 * Drops the secondary indexes of the bulk-loaded tables (building them once after the load is much faster than
 * updating them row by row) and returns their exact definitions to recreate. Indexes behind constraints stay.
 */
export async function dropSecondaryIndexes(client: pg.ClientBase, tables = LOADED_TABLES): Promise<string[]> {
  const { rows } = await client.query<{ name: string; def: string }>(
    `select quote_ident(ic.relname) as name, pg_get_indexdef(i.indexrelid) as def
       from pg_index i
       join pg_class t on t.oid = i.indrelid
       join pg_class ic on ic.oid = i.indexrelid
      where t.relname = any($1) and t.relnamespace = 'public'::regnamespace
        and not i.indisprimary
        and not exists (select 1 from pg_constraint c where c.conindid = i.indexrelid)`,
    [tables],
  );
  for (const r of rows) await client.query(`drop index ${r.name}`);
  return rows.map((r) => r.def);
}

export async function recreateIndexes(client: pg.ClientBase, defs: string[]) {
  for (const def of defs) await client.query(def);
}

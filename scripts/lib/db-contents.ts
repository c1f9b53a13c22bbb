import pg from 'pg';

/** The tables that make up an appliance's life record, each summed up by a checksum over its rows. */
export const LIFE_RECORD_TABLES = [
  'customers',
  'sites',
  'appliances',
  'components',
  'visits',
  'visit_amendments',
  'part_swaps',
  'timeline_events',
  'makeup_water_entries',
  'photos',
  'tags',
  'service_requests',
  'reminders',
] as const;

async function withClient<T>(url: string, fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

const quoted = (schema: string, table: string) => `"${schema.replace(/"/g, '""')}"."${table.replace(/"/g, '""')}"`;

/** Rows in every table of every schema the app owns (not PostgreSQL's own), keyed `schema.table`. */
export function tableCounts(url: string): Promise<Record<string, number>> {
  return withClient(url, async (c) => {
    const { rows: tables } = await c.query<{ schema: string; table: string }>(
      `select table_schema as schema, table_name as "table" from information_schema.tables
        where table_type = 'BASE TABLE' and table_schema not in ('pg_catalog', 'information_schema') order by 1, 2`,
    );
    const out: Record<string, number> = {};
    for (const t of tables) out[`${t.schema}.${t.table}`] = Number((await c.query(`select count(*) from ${quoted(t.schema, t.table)}`)).rows[0].count);
    return out;
  });
}

/** md5 over each life-record table's rows as text, in a fixed order: equal only if every value of every row is. */
export function lifeRecordChecksums(url: string): Promise<Record<string, string>> {
  return withClient(url, async (c) => {
    const out: Record<string, string> = {};
    for (const table of LIFE_RECORD_TABLES) {
      const { rows } = await c.query<{ md5: string | null }>(`select md5(coalesce(string_agg(t::text, E'\\n' order by t::text), '')) as md5 from ${quoted('public', table)} t`);
      out[table] = rows[0].md5 ?? '';
    }
    return out;
  });
}

import crypto from 'node:crypto';
import type pg from 'pg';

/**
 * Seeded pseudo-randomness that does not depend on row order: every value is a hash of the seed and a key naming
 * what it decides (e.g. "0:a:123" for appliance 123 of company 0). The same seed gives the same data set.
 * The SQL functions live in pg_temp, so they vanish with the loading session.
 */
export async function createSeededFunctions(client: pg.ClientBase, seed: number) {
  const s = Math.trunc(seed);
  await client.query(`
    create function pg_temp.h(k text) returns float8 language sql immutable parallel safe as
      $$ select ('x' || substr(md5('${s}:' || k), 1, 8))::bit(32)::bigint / 4294967296.0 $$;
    create function pg_temp.uid(k text) returns uuid language sql immutable parallel safe as
      $$ select overlay(overlay(md5('${s}:' || k) placing '4' from 13) placing 'a' from 17)::uuid $$;
    create function pg_temp.pick(arr text[], k text) returns text language sql immutable parallel safe as
      $$ select arr[1 + floor(pg_temp.h(k) * cardinality(arr))::int] $$;
    create function pg_temp.between_int(lo int, hi int, k text) returns int language sql immutable parallel safe as
      $$ select lo + floor(pg_temp.h(k) * (hi - lo + 1))::int $$;
  `);
}

/** The same uuid pg_temp.uid gives, computed in JS (for rows inserted through Drizzle). */
export function seededUuid(seed: number, key: string): string {
  const hex = crypto.createHash('md5').update(`${Math.trunc(seed)}:${key}`).digest('hex').split('');
  hex[12] = '4';
  hex[16] = 'a';
  const h = hex.join('');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

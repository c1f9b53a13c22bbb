import type { Faker } from '@faker-js/faker';
import type pg from 'pg';
import { generateTagCode } from '../../shared/tags/tag-code';
import { MAX_TAGS_PER_BATCH } from '../../shared/schemas/tags';

const ASSIGNED_SHARE = 0.95;
const SPARE_SHARE = 0.02;
const CHUNK = 20_000;

/**
 * Tags with real check characters (made by the app's own generator from seeded bytes), printed in batches of
 * the usual size: most appliances carry one, and each company keeps a few spare. Returns how many were made.
 */
export async function loadTags(client: pg.ClientBase, f: Faker, companies: { k: number; appliances: number }[]) {
  const seen = new Set<string>();
  const randomBytes = (n: number) => Uint8Array.from({ length: n }, () => f.number.int(255));
  const newCode = () => {
    let code = generateTagCode(randomBytes);
    while (seen.has(code)) code = generateTagCode(randomBytes);
    seen.add(code);
    return code;
  };
  const ks: number[] = [];
  const codes: string[] = [];
  const ns: number[] = [];
  const batches: number[] = [];
  for (const c of companies) {
    let made = 0;
    const add = (n: number) => {
      ks.push(c.k);
      codes.push(newCode());
      ns.push(n);
      batches.push(Math.floor(made++ / MAX_TAGS_PER_BATCH));
    };
    for (let n = 1; n <= c.appliances; n++) if (f.number.float() < ASSIGNED_SHARE) add(n);
    for (let i = 0; i < Math.ceil(c.appliances * SPARE_SHARE); i++) add(0);
  }
  await client.query(
    `insert into tag_batches (id, company_id, format, count, created_by)
     select pg_temp.uid(t.k || ':tb:' || t.b), co.id, 'sheet_1x2_625', t.count, co.techs[1]
       from (select k, b, count(*)::int as count from unnest($1::int[], $2::int[]) as u(k, b) group by k, b) t
       join bench_co co on co.k = t.k`,
    [ks, batches],
  );
  for (let i = 0; i < codes.length; i += CHUNK) {
    await client.query(
      `insert into tags (id, company_id, code, batch_id, appliance_id, status, assigned_at, assigned_by)
       select pg_temp.uid(t.k || ':t:' || t.code), co.id, t.code, pg_temp.uid(t.k || ':tb:' || t.b),
         case when t.n > 0 then pg_temp.uid(t.k || ':a:' || t.n) end,
         (case when t.n > 0 then 'assigned' else 'unassigned' end)::tag_status,
         case when t.n > 0 then now() end, case when t.n > 0 then co.techs[1] end
       from unnest($1::int[], $2::text[], $3::int[], $4::int[]) as t(k, code, n, b)
       join bench_co co on co.k = t.k`,
      [ks.slice(i, i + CHUNK), codes.slice(i, i + CHUNK), ns.slice(i, i + CHUNK), batches.slice(i, i + CHUNK)],
    );
  }
  return codes.length;
}

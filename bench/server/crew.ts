import type pg from 'pg';
import { signIn } from './boot';
import type { CrewMember } from './technicians';

export const crewEmail = (i: number) => `crew-${i}@bench.test`;

/**
 * `count` technicians of the company, crew-1@bench.test … (made once, kept for the next run), with the password
 * of the bench's own technician: its stored hash is copied, so nothing is hashed here.
 */
export async function ensureCrew(pool: pg.Pool, companyId: string, count: number): Promise<{ userId: string; email: string }[]> {
  const emails = Array.from({ length: count }, (_, i) => crewEmail(i + 1));
  const { rows: hash } = await pool.query<{ password: string }>(
    `select a.password from accounts a join memberships m on m.user_id = a.user_id
      where m.company_id = $1 and m.role = 'technician' and a.provider_id = 'credential' and a.password is not null limit 1`,
    [companyId],
  );
  if (!hash.length) throw new Error('The bench company has no technician with a password to copy.');
  const client = await pool.connect();
  try {
    await client.query('begin');
    const { rows: made } = await client.query<{ id: string }>(
      `insert into users (name, email, email_verified) select 'Crew technician ' || n, e, true from unnest($1::text[]) with ordinality as x(e, n)
        on conflict (email) do nothing returning id`,
      [emails],
    );
    const ids = made.map((r) => r.id);
    await client.query(
      `insert into accounts (account_id, provider_id, user_id, password, updated_at) select u::text, 'credential', u, $2, now() from unnest($1::uuid[]) as u`,
      [ids, hash[0].password],
    );
    await client.query(`insert into memberships (company_id, user_id, role) select $2, u, 'technician' from unnest($1::uuid[]) as u`, [ids, companyId]);
    await client.query('commit');
  } catch (err) {
    await client.query('rollback');
    throw err;
  } finally {
    client.release();
  }
  const { rows } = await pool.query<{ id: string; email: string }>(
    `select u.id, u.email from users u join memberships m on m.user_id = u.id and m.company_id = $2 and m.deactivated_at is null where u.email = any($1::text[]) order by u.email`,
    [emails, companyId],
  );
  if (rows.length !== count) throw new Error(`Expected ${count} crew technicians of the bench company, found ${rows.length}.`);
  return rows.map((r) => ({ userId: r.id, email: r.email }));
}

/** Signs each one in through better-auth, a few at a time (scrypt is deliberately slow). */
export async function signInCrew(baseUrl: string, people: { userId: string; email: string }[], password: string, atOnce = 8): Promise<CrewMember[]> {
  const out: CrewMember[] = [];
  for (let i = 0; i < people.length; i += atOnce) {
    const batch = people.slice(i, i + atOnce);
    out.push(...(await Promise.all(batch.map(async (p) => ({ userId: p.userId, cookie: await signIn(baseUrl, p.email, password) })))));
  }
  return out;
}

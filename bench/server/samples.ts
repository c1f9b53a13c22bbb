import type pg from 'pg';

export type Samples = { applianceIds: string[]; tagCodes: string[]; searchTexts: string[] };

/**
 * Request parameters drawn from the data: every appliance of the large company, a sample of its attached tag
 * codes, and search text as people type it (a surname's first letters, a name, a house number and street).
 */
export async function loadSamples(pool: pg.Pool, companyId: string): Promise<Samples> {
  const applianceIds = (await pool.query<{ id: string }>('select id from appliances where company_id = $1', [companyId])).rows.map((r) => r.id);
  const tagCodes = (
    await pool.query<{ code: string }>(`select code from tags where company_id = $1 and status = 'assigned' order by md5(code) limit 20000`, [companyId])
  ).rows.map((r) => r.code);
  const people = (
    await pool.query<{ name: string; street: string }>(
      `select c.name, s.street from customers c join sites s on s.customer_id = c.id where c.company_id = $1 order by md5(c.id::text) limit 1500`,
      [companyId],
    )
  ).rows;
  const searchTexts = people.map((p, i) => {
    const [first, ...rest] = p.name.split(' ');
    const last = rest.join(' ');
    if (i % 3 === 0) return last.slice(0, 4);
    if (i % 3 === 1) return `${first} ${last.slice(0, 3)}`;
    const [number, word] = p.street.split(' ');
    return `${number} ${(word ?? '').slice(0, 3)}`.trim();
  }).filter((t) => t.trim().length >= 2);
  if (!applianceIds.length || !tagCodes.length || !searchTexts.length) throw new Error('The bench database has no appliances, tags or customers for the large company.');
  return { applianceIds, tagCodes, searchTexts };
}

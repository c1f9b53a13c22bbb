import { and, asc, desc, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { customers } from '../../db/schema/index';
import { escapeLike } from '../../lib/like';
import type { CustomerSort } from './customer-cursor';

export type CustomerRow = typeof customers.$inferSelect;
type NewCustomer = Omit<typeof customers.$inferInsert, 'id'>;

// Written out in full: drizzle drops table names inside the select list of a one-table query.
const firstTown = sql<string | null>`(select min(s.town) from sites s where s.customer_id = "customers"."id")`;
const siteCount = sql<number>`(select count(*)::int from sites s where s.customer_id = "customers"."id")`;
const applianceCount = sql<number>`(select count(*)::int from appliances a join sites s on s.id = a.site_id
  where s.customer_id = "customers"."id" and a.status <> 'removed')`;

/** Keyset columns per sort, each with the SQL type its cursor text is cast back to. All run in one direction. */
const SORTS: Record<CustomerSort, { keys: { expr: SQL; type: string }[]; direction: 'asc' | 'desc' }> = {
  name: { keys: [{ expr: sql`"customers"."name"`, type: 'text' }, { expr: sql`"customers"."id"`, type: 'uuid' }], direction: 'asc' },
  town: {
    // Customers without a site sort last: (town is null) is false before true.
    keys: [
      { expr: sql`(${firstTown} is null)`, type: 'boolean' },
      { expr: sql`coalesce(${firstTown}, '')`, type: 'text' },
      { expr: sql`"customers"."name"`, type: 'text' },
      { expr: sql`"customers"."id"`, type: 'uuid' },
    ],
    direction: 'asc',
  },
  created: { keys: [{ expr: sql`"customers"."created_at"`, type: 'timestamptz' }, { expr: sql`"customers"."id"`, type: 'uuid' }], direction: 'desc' },
};

export const sortKeyCount = (sort: CustomerSort) => SORTS[sort].keys.length;

export const customersRepository = {
  async insert(db: DbOrTx, values: NewCustomer) {
    const [row] = await db.insert(customers).values(values).returning();
    return row;
  },
  async update(db: DbOrTx, companyId: string, id: string, values: Partial<NewCustomer>) {
    const [row] = await db
      .update(customers)
      .set(values)
      .where(and(eq(customers.companyId, companyId), eq(customers.id, id)))
      .returning();
    return row ?? null;
  },
  async list(db: DbOrTx, q: { companyId: string; sort: CustomerSort; after: string[] | null; limit: number; text?: string }) {
    const def = SORTS[q.sort];
    const tuple = sql.join(def.keys.map((k) => k.expr), sql`, `);
    const afterTuple = q.after && sql.join(q.after.map((v, i) => sql`cast(${v} as ${sql.raw(def.keys[i].type)})`), sql`, `);
    const pattern = q.text ? `%${escapeLike(q.text)}%` : null;
    const rows = await db
      .select({
        customer: customers,
        siteCount,
        applianceCount,
        firstTown,
        keys: sql<string[]>`array[${sql.join(def.keys.map((k) => sql`(${k.expr})::text`), sql`, `)}]`,
      })
      .from(customers)
      .where(
        and(
          eq(customers.companyId, q.companyId),
          pattern ? or(ilike(customers.name, pattern), ilike(customers.phone, pattern), ilike(customers.email, pattern)) : undefined,
          afterTuple ? (def.direction === 'asc' ? sql`(${tuple}) > (${afterTuple})` : sql`(${tuple}) < (${afterTuple})`) : undefined,
        ),
      )
      .orderBy(...def.keys.map((k) => (def.direction === 'asc' ? asc(k.expr) : desc(k.expr))))
      .limit(q.limit + 1);
    return rows;
  },
};

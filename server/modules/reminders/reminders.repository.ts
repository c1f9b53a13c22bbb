import { and, desc, eq, inArray, lt, or, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { auditLog, companies, customers, reminders } from '../../db/schema/index';
import type { ApplianceKind, Fuel } from '../../../shared/schemas/enums';
import type { ReminderStatus } from '../../../shared/schemas/reminders';

export type ReminderRow = typeof reminders.$inferSelect;
export type NewReminder = typeof reminders.$inferInsert;

type AnnualCandidate = {
  appliance_id: string;
  appliance_status: string;
  customer_id: string;
  reminders_opt_out: boolean;
  email: string | null;
  due_on: string;
};

/**
 * The annual-service due date of each in-service appliance: its last completed annual maintenance plus one year.
 * Never serviced: the install date plus one year, else the day the record was made plus one year (UTC), so the date
 * stays the same from run to run until the first annual visit starts a new period.
 */
const annualDueOn = sql`(coalesce(la.last_annual_on, a.installed_on, (a.created_at at time zone 'UTC')::date) + interval '1 year')::date`;

function annualQuery(companyId: string, where: ReturnType<typeof sql>) {
  return sql`
    select a.id as appliance_id, a.status as appliance_status, c.id as customer_id, c.reminders_opt_out, c.email,
           ${annualDueOn}::text as due_on
    from appliances a
    join sites s on s.id = a.site_id and s.company_id = a.company_id
    join customers c on c.id = s.customer_id and c.company_id = a.company_id
    left join lateral (
      select max(v.visited_on) as last_annual_on
      from visits v
      where v.appliance_id = a.id and v.company_id = a.company_id and v.status = 'completed' and v.type = 'annual_maintenance'
    ) la on true
    where a.company_id = ${companyId} and ${where}
  `;
}

type PartCandidate = {
  component_id: string;
  appliance_id: string;
  customer_id: string;
  type_code: string;
  spec_key: string;
  catalog_label: string | null;
  due_on: string;
};

/** What the scheduled run reminds about, the details each e-mail line needs, and the reminder list. */
export const remindersRepository = {
  /** In-service appliances whose annual service fell due on or before `through`. */
  async annualDue(db: DbOrTx, companyId: string, through: string) {
    const result = await db.execute<AnnualCandidate>(
      annualQuery(companyId, sql`a.status = 'in_service' and ${annualDueOn} <= ${through}::date`),
    );
    return result.rows;
  },

  /** One appliance's current annual-service period, whatever its date (the office may remind early). */
  async annualForAppliance(db: DbOrTx, companyId: string, applianceId: string): Promise<AnnualCandidate | null> {
    const result = await db.execute<AnnualCandidate>(annualQuery(companyId, sql`a.id = ${applianceId}`));
    return result.rows[0] ?? null;
  },

  /**
   * Present parts of in-service appliances due for replacement on or before `through`. Parts due only for inspection
   * are checked at the annual service, which has its own reminder; listing each of them would bury the ones to replace.
   */
  async partsDue(db: DbOrTx, companyId: string, through: string) {
    const result = await db.execute<PartCandidate>(sql`
      select p.id as component_id, a.id as appliance_id, c.id as customer_id, p.type_code, p.spec_key, cat.label as catalog_label,
             p.due_on::text as due_on
      from components p
      join appliances a on a.id = p.appliance_id and a.company_id = p.company_id
      join sites s on s.id = a.site_id and s.company_id = a.company_id
      join customers c on c.id = s.customer_id and c.company_id = a.company_id
      left join component_catalog cat on cat.company_id = p.company_id and cat.code = p.type_code
      where p.company_id = ${companyId} and p.removed_on is null and p.due_on is not null and p.due_on <= ${through}::date
        and p.due_kind = 'replacement' and a.status = 'in_service'
    `);
    return result.rows;
  },

  /** Inserts each row unless its (appliance, kind, part, due period) already exists; returns only the rows it wrote. */
  async insertNew(db: DbOrTx, rows: NewReminder[]) {
    if (!rows.length) return [];
    return db.insert(reminders).values(rows).onConflictDoNothing().returning({ id: reminders.id });
  },

  async findExisting(db: DbOrTx, key: { applianceId: string; kind: ReminderRow['kind']; partKey: string; dueOn: string }) {
    const [row] = await db
      .select()
      .from(reminders)
      .where(
        and(
          eq(reminders.applianceId, key.applianceId),
          eq(reminders.kind, key.kind),
          eq(reminders.partKey, key.partKey),
          eq(reminders.dueOn, key.dueOn),
        ),
      )
      .limit(1);
    return row ?? null;
  },

  /**
   * Takes rows back to 'pending' for another try. The status condition makes the claim atomic: when two runs race,
   * only one UPDATE matches the row, so only one of them sends.
   */
  async claim(db: DbOrTx, q: { companyId: string; from: ReminderStatus[]; ids?: string[]; maxAttempts?: number; set?: Partial<NewReminder> }) {
    return db
      .update(reminders)
      .set({ ...q.set, status: 'pending' })
      .where(
        and(
          eq(reminders.companyId, q.companyId),
          inArray(reminders.status, q.from),
          q.ids ? inArray(reminders.id, q.ids) : undefined,
          q.maxAttempts ? lt(reminders.attempts, q.maxAttempts) : undefined,
        ),
      )
      .returning({ id: reminders.id });
  },

  /**
   * Rows among `keys` (reminders still due) that could not go out before, for lack of an address or because the
   * customer had opted out, whose customer can be reached now: back to 'pending', atomically as in `claim`.
   */
  async claimNowReachable(db: DbOrTx, companyId: string, keys: Pick<NewReminder, 'applianceId' | 'kind' | 'partKey' | 'dueOn'>[]) {
    if (!keys.length) return [];
    const result = await db.execute<{ id: string }>(sql`
      update reminders r set status = 'pending'
      from customers c
      where r.company_id = ${companyId} and r.status in ('no_email', 'opted_out')
        and c.id = r.customer_id and c.company_id = r.company_id
        and coalesce(c.email, '') <> '' and not c.reminders_opt_out
        and (r.appliance_id, r.kind::text, r.part_key, r.due_on) in (
          select k.appliance_id, k.kind, k.part_key, k.due_on
          from jsonb_to_recordset(${JSON.stringify(keys.map((k) => ({ appliance_id: k.applianceId, kind: k.kind, part_key: k.partKey ?? '', due_on: k.dueOn })))}::jsonb)
            as k(appliance_id uuid, kind text, part_key text, due_on date)
        )
      returning r.id
    `);
    return result.rows;
  },

  /** The pending rows with everything an e-mail line needs, the customer's current address and choice included. */
  async pendingWithDetails(db: DbOrTx, companyId: string, ids: string[]) {
    if (!ids.length) return [];
    const result = await db.execute<{
      id: string;
      kind: ReminderRow['kind'];
      due_on: string;
      part_label: string | null;
      due_kind: 'inspection' | 'replacement' | null;
      condition_failed: boolean | null;
      appliance_id: string;
      appliance_kind: ApplianceKind;
      fuel: Fuel;
      street: string;
      town: string;
      customer_id: string;
      customer_name: string;
      email: string | null;
      reminders_opt_out: boolean;
      attempts: number;
    }>(sql`
      select r.id, r.kind, r.due_on::text as due_on, r.part_label, p.due_kind, p.condition_failed, r.appliance_id, a.kind as appliance_kind, a.fuel,
             s.street, s.town, c.id as customer_id, c.name as customer_name, c.email, c.reminders_opt_out, r.attempts
      from reminders r
      join appliances a on a.id = r.appliance_id and a.company_id = r.company_id
      join sites s on s.id = a.site_id
      join customers c on c.id = r.customer_id and c.company_id = r.company_id
      left join components p on p.id = r.component_id
      where r.company_id = ${companyId} and r.status = 'pending' and r.id in (${sql.join(ids.map((id) => sql`${id}::uuid`), sql`, `)})
      order by c.id, r.kind, r.due_on, r.id
    `);
    return result.rows;
  },

  async finish(db: DbOrTx, id: string, change: Partial<NewReminder>) {
    const [row] = await db.update(reminders).set(change).where(eq(reminders.id, id)).returning();
    return row!;
  },

  /** Newest first, keyset on (created_at, id). */
  async list(db: DbOrTx, q: { companyId: string; applianceId?: string; before?: { createdAt: Date; id: string } | null; limit: number }) {
    return db
      .select({ reminder: reminders, customerName: customers.name })
      .from(reminders)
      .innerJoin(customers, eq(customers.id, reminders.customerId))
      .where(
        and(
          eq(reminders.companyId, q.companyId),
          q.applianceId ? eq(reminders.applianceId, q.applianceId) : undefined,
          q.before
            ? or(lt(reminders.createdAt, q.before.createdAt), and(eq(reminders.createdAt, q.before.createdAt), lt(reminders.id, q.before.id)))
            : undefined,
        ),
      )
      .orderBy(desc(reminders.createdAt), desc(reminders.id))
      .limit(q.limit);
  },

  async findWithCustomer(db: DbOrTx, companyId: string, id: string) {
    const [row] = await db
      .select({ reminder: reminders, customerName: customers.name })
      .from(reminders)
      .innerJoin(customers, eq(customers.id, reminders.customerId))
      .where(and(eq(reminders.companyId, companyId), eq(reminders.id, id)))
      .limit(1);
    return row ?? null;
  },

  /** Looked up by id alone: the unsubscribe token (signed by us) is what names the customer. */
  async customerForUnsubscribe(db: DbOrTx, customerId: string) {
    const [row] = await db
      .select({ customerId: customers.id, companyId: customers.companyId, optedOut: customers.remindersOptOut, companyName: companies.name, companyPhone: companies.phone })
      .from(customers)
      .innerJoin(companies, eq(companies.id, customers.companyId))
      .where(eq(customers.id, customerId))
      .limit(1);
    return row ?? null;
  },

  /** The customer's own choice, made without signing in: audited with no actor. */
  async optOut(db: DbOrTx, companyId: string, customerId: string) {
    await db.update(customers).set({ remindersOptOut: true }).where(and(eq(customers.companyId, companyId), eq(customers.id, customerId)));
    await db.insert(auditLog).values({
      companyId,
      actorId: null,
      action: 'update',
      entity: 'customer',
      entityId: customerId,
      changes: { before: { remindersOptOut: false }, after: { remindersOptOut: true }, via: 'unsubscribe_link' },
    });
  },
};

import type { DbOrTx } from '../client';
import { customers } from '../schema/index';
import { fakerFor } from './faker';

export async function insertCustomer(db: DbOrTx, overrides: Partial<typeof customers.$inferInsert> & { companyId: string }) {
  const f = fakerFor();
  const [row] = await db
    .insert(customers)
    .values({
      name: f.person.fullName(),
      phone: `555-${f.string.numeric(4)}`,
      email: f.internet.email({ provider: 'example.test' }).toLowerCase(),
      ...overrides,
    })
    .returning();
  return row;
}

import { eq } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { companies } from '../../db/schema/index';
import type { CompanySettingsInput } from '../../../shared/schemas/company';

export const companyRepository = {
  async findById(db: DbOrTx, companyId: string) {
    const [row] = await db.select().from(companies).where(eq(companies.id, companyId)).limit(1);
    return row ?? null;
  },
  async update(db: DbOrTx, companyId: string, input: CompanySettingsInput) {
    const [row] = await db.update(companies).set(input).where(eq(companies.id, companyId)).returning();
    return row ?? null;
  },
};

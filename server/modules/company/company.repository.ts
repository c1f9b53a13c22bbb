import { eq, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../db/client';
import { companies } from '../../db/schema/index';
import type { CompanySettingsInput } from '../../../shared/schemas/company';

export const companyRepository = {
  async findById(db: DbOrTx, companyId: string) {
    const [row] = await db.select().from(companies).where(eq(companies.id, companyId)).limit(1);
    return row ?? null;
  },
  async update(db: DbOrTx, companyId: string, input: CompanySettingsInput) {
    const { bookingMinutes, ...rest } = input;
    // The kinds named replace the stored ones in place (jsonb ||), so two settings saved at once both stay.
    const minutes = bookingMinutes ? { bookingMinutes: sql`${companies.bookingMinutes} || ${JSON.stringify(bookingMinutes)}::jsonb` } : {};
    const [row] = await db.update(companies).set({ ...rest, ...minutes }).where(eq(companies.id, companyId)).returning();
    return row ?? null;
  },
};

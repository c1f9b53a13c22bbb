import type { DbOrTx } from '../client';
import { companies } from '../schema/index';
import { seedCompanyCatalog } from '../../modules/catalog';
import { seedCompanyChecklists } from '../../modules/checklists';
import { seedCompanyDueRules } from '../../modules/due';
import { fakerFor } from './faker';
import { pickInvented, INVENTED_COMPANY_NAMES } from './invented-names';

export async function insertCompany(db: DbOrTx, overrides: Partial<typeof companies.$inferInsert> = {}) {
  const f = fakerFor();
  const [company] = await db
    .insert(companies)
    .values({
      name: `${pickInvented(f, INVENTED_COMPANY_NAMES)} ${f.string.alphanumeric(4).toUpperCase()}`,
      phone: `555-01${f.number.int({ min: 10, max: 99 })}`,
      timeZone: 'America/New_York',
      ...overrides,
    })
    .returning();
  // Every company, in tests and the demo alike, starts with the part catalog, the default checklists and due rules.
  await seedCompanyCatalog(db, company.id);
  await seedCompanyChecklists(db, company.id);
  await seedCompanyDueRules(db, company.id);
  return company;
}

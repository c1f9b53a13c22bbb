import type { DbOrTx } from '../../db/client';
import { todayInTimeZone } from '../../../shared/dates';
import { notFound } from '../../lib/http-error';
import { companyRepository } from '../company/company.repository';

/** Today's date where the company works: "due today" and a visit's date follow the company's time zone. */
export async function companyToday(db: DbOrTx, companyId: string): Promise<string> {
  const company = await companyRepository.findById(db, companyId);
  if (!company) throw notFound('Company');
  return todayInTimeZone(company.timeZone);
}

import type { DbOrTx } from '../db/client';
import { todayInTimeZone } from '../../shared/dates';
import { notFound } from '../lib/http-error';
import { findCompany } from './tenant-finders';

/** Today's date where the company works: "due today" and a visit's date follow the company's time zone. */
export async function companyToday(db: DbOrTx, companyId: string): Promise<string> {
  const company = await findCompany(db, companyId);
  if (!company) throw notFound('Company');
  return todayInTimeZone(company.timeZone);
}

/** The company's today and its "due soon" window (companies.due_soon_days): what decides "due soon" for it. */
export async function companyDueClock(db: DbOrTx, companyId: string): Promise<{ today: string; dueSoonDays: number }> {
  const company = await findCompany(db, companyId);
  if (!company) throw notFound('Company');
  return { today: todayInTimeZone(company.timeZone), dueSoonDays: company.dueSoonDays };
}

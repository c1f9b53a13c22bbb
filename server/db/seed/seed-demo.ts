import { eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { companies } from '../schema/index';
import { insertCompany } from '../factories/companies';
import { insertHomeowner, insertMember } from '../factories/users';
import { insertCustomer } from '../factories/records';
import { DEMO_COMPANY, DEMO_HOMEOWNER, DEMO_MEMBERS, DEMO_PASSWORD, OTHER_COMPANY } from './demo-accounts';
import { seedDemoRecords } from './demo-records';
import { applyDemoCompanyPolicies } from './demo-company-policies';
import { recomputeDueForCompany } from '../../modules/due';
import { seedDemoMakeupWater } from './demo-makeup-water';
import { demoClock } from './demo-clock';
import { seedDemoBookings } from './demo-bookings';
import { addYears } from '../../../shared/trade/iso-date';

/**
 * Seeds the invented demo scenario once; a second run finds the demo company and does nothing. Its history ends at
 * `now` (the real clock unless given) on each company's own clocks: nothing in it has not happened yet.
 */
export async function seedDemo(db: DbOrTx, { now = new Date() }: { now?: Date } = {}): Promise<{ seeded: boolean }> {
  const [existing] = await db.select({ id: companies.id }).from(companies).where(eq(companies.name, DEMO_COMPANY.name)).limit(1);
  if (existing) return { seeded: false };

  const clock = demoClock(now, DEMO_COMPANY.timeZone);
  await db.transaction(async (tx) => {
    const demo = await insertCompany(tx, DEMO_COMPANY);
    const other = await insertCompany(tx, OTHER_COMPANY);
    const userIds: Record<string, string> = {};
    for (const m of DEMO_MEMBERS) {
      const { user } = await insertMember(tx, {
        companyId: m.company === 'demo' ? demo.id : other.id,
        role: m.role,
        email: m.email,
        name: m.name,
        password: DEMO_PASSWORD,
      });
      userIds[m.email] = user.id;
    }
    const homeownerCustomer = await insertCustomer(tx, {
      companyId: demo.id,
      name: DEMO_HOMEOWNER.name,
      email: DEMO_HOMEOWNER.email,
      phone: '555-0110',
      createdAt: clock.at(addYears(clock.today, -6), 10),
    });
    await insertHomeowner(tx, { companyId: demo.id, customerId: homeownerCustomer.id, ...DEMO_HOMEOWNER, password: DEMO_PASSWORD });
    await seedDemoRecords(tx, { demoCompanyId: demo.id, otherCompanyId: other.id, homeownerCustomerId: homeownerCustomer.id, userIds }, now);
    await seedDemoMakeupWater(tx, { companyId: demo.id, homeownerCustomerId: homeownerCustomer.id, clock });
    await applyDemoCompanyPolicies(tx, demo.id);
    await recomputeDueForCompany(tx, demo.id, { today: clock.today });
    await seedDemoBookings(tx, {
      companyId: demo.id,
      technicianIds: DEMO_MEMBERS.filter((m) => m.company === 'demo' && m.role === 'technician').map((m) => userIds[m.email]),
      managerId: userIds['manager@demo.test'],
      clock,
    });
  });
  return { seeded: true };
}

import type { Faker } from '@faker-js/faker';
import type { Db } from '../../server/db/client';
import { accounts, memberships, users } from '../../server/db/schema/index';
import type { MemberRole } from '../../shared/schemas/roles';
import { seededUuid } from './seeded-sql';

export const BENCH_PASSWORD = 'lifeplate-bench';
const EXTRA_TECHNICIANS_LARGE = 24;
const TECHNICIANS_SMALL = 2;

export type BenchCompanyUsers = { technicianIds: string[]; signIn: { email: string; role: MemberRole }[] };

/**
 * Members for every company. The large company gets one member per role with BENCH_PASSWORD (for signing in)
 * and a crew of technicians the sites are assigned to; each small company an owner and two technicians.
 */
export async function insertBenchUsers(db: Db, f: Faker, seed: number, companies: { k: number; id: string }[], passwordHash: string) {
  const out: BenchCompanyUsers[] = [];
  const userRows: (typeof users.$inferInsert)[] = [];
  const memberRows: (typeof memberships.$inferInsert)[] = [];
  for (const c of companies) {
    const people: { email: string; role: MemberRole }[] =
      c.k === 0
        ? [
            { email: 'owner@bench.test', role: 'owner' },
            { email: 'manager@bench.test', role: 'manager' },
            { email: 'tech@bench.test', role: 'technician' },
            ...Array.from({ length: EXTRA_TECHNICIANS_LARGE }, (_, i) => ({ email: `tech-${i + 1}@bench.test`, role: 'technician' as const })),
          ]
        : [
            { email: `owner-${c.k}@bench.test`, role: 'owner' },
            ...Array.from({ length: TECHNICIANS_SMALL }, (_, i) => ({ email: `tech-${c.k}-${i + 1}@bench.test`, role: 'technician' as const })),
          ];
    const technicianIds: string[] = [];
    people.forEach((p, i) => {
      const id = seededUuid(seed, `u:${c.k}:${i}`);
      userRows.push({ id, name: f.person.fullName(), email: p.email, emailVerified: true });
      memberRows.push({ companyId: c.id, userId: id, role: p.role });
      if (p.role === 'technician') technicianIds.push(id);
    });
    out.push({ technicianIds, signIn: c.k === 0 ? people.slice(0, 3) : [] });
  }
  await db.insert(users).values(userRows);
  await db.insert(accounts).values(userRows.map((u) => ({ accountId: u.id!, providerId: 'credential', userId: u.id!, password: passwordHash })));
  await db.insert(memberships).values(memberRows);
  return out;
}

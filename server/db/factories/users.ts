import { hashPassword } from 'better-auth/crypto';
import type { DbOrTx } from '../client';
import { accounts, homeownerAccounts, memberships, users } from '../schema/index';
import type { MemberRole } from '../../../shared/schemas/roles';
import { fakerFor } from './faker';

const hashes = new Map<string, Promise<string>>();
/** scrypt is deliberately slow; the same password is hashed once per process. */
const hashOnce = (password: string) => {
  if (!hashes.has(password)) hashes.set(password, hashPassword(password));
  return hashes.get(password)!;
};

export const DEFAULT_TEST_PASSWORD = 'lifeplate-test-password';

export async function insertUser(db: DbOrTx, overrides: { email?: string; name?: string; password?: string } = {}) {
  const f = fakerFor();
  const name = overrides.name ?? f.person.fullName();
  const email = (overrides.email ?? `${f.string.alphanumeric(10)}@example.test`).toLowerCase();
  const [user] = await db.insert(users).values({ name, email, emailVerified: true }).returning();
  await db.insert(accounts).values({
    accountId: user.id,
    providerId: 'credential',
    userId: user.id,
    password: await hashOnce(overrides.password ?? DEFAULT_TEST_PASSWORD),
  });
  return user;
}

export async function insertMember(
  db: DbOrTx,
  input: { companyId: string; role: MemberRole; email?: string; name?: string; password?: string },
) {
  const user = await insertUser(db, input);
  const [membership] = await db.insert(memberships).values({ companyId: input.companyId, userId: user.id, role: input.role }).returning();
  return { user, membership };
}

export async function insertHomeowner(
  db: DbOrTx,
  input: { companyId: string; customerId: string; email?: string; name?: string; password?: string },
) {
  const user = await insertUser(db, input);
  await db.insert(homeownerAccounts).values({ companyId: input.companyId, customerId: input.customerId, userId: user.id });
  return { user };
}

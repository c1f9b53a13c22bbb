import request from 'supertest';
import type { Express } from 'express';
import type { Db } from '../../server/db/client';
import { insertCompany } from '../../server/db/factories/companies';
import { insertHomeowner, insertMember, DEFAULT_TEST_PASSWORD } from '../../server/db/factories/users';
import { insertCustomer } from '../../server/db/factories/records';

export type Agent = ReturnType<typeof request.agent>;

export async function signIn(app: Express, email: string, password = DEFAULT_TEST_PASSWORD): Promise<Agent> {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/sign-in/email').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

/** A fresh company with one person per role, so each test file works on data of its own. */
export async function createTenant(db: Db) {
  const company = await insertCompany(db);
  const owner = await insertMember(db, { companyId: company.id, role: 'owner' });
  const manager = await insertMember(db, { companyId: company.id, role: 'manager' });
  const technician = await insertMember(db, { companyId: company.id, role: 'technician' });
  const customer = await insertCustomer(db, { companyId: company.id });
  const homeowner = await insertHomeowner(db, { companyId: company.id, customerId: customer.id });
  return { company, owner, manager, technician, customer, homeowner };
}

export type Tenant = Awaited<ReturnType<typeof createTenant>>;

export async function agentsFor(app: Express, t: Tenant) {
  const [owner, manager, technician, homeowner] = await Promise.all([
    signIn(app, t.owner.user.email),
    signIn(app, t.manager.user.email),
    signIn(app, t.technician.user.email),
    signIn(app, t.homeowner.user.email),
  ]);
  return { owner, manager, technician, homeowner, anonymous: request(app) };
}

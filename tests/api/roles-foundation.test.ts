import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, companies, memberships, sessions } from '../../server/db/schema/index';
import { testApp } from '../support/context';
import { agentsFor, createTenant, signIn, type Tenant } from '../support/tenant';

const { app, ctx } = testApp();
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
});
afterAll(() => ctx.pool.end());

describe('row: read the company records', () => {
  it('lets owner, manager and technician read; homeowner 403; signed out 401', async () => {
    for (const agent of [as.owner, as.manager, as.technician]) {
      const res = await agent.get('/api/members');
      expect(res.status).toBe(200);
      expect(res.body.map((m: { email: string }) => m.email).sort()).toEqual(
        [t.owner.user.email, t.manager.user.email, t.technician.user.email].sort(),
      );
    }
    expect((await as.homeowner.get('/api/members')).status).toBe(403);
    const anon = await as.anonymous.get('/api/company');
    expect(anon.status).toBe(401);
    expect(anon.body).toEqual({ error: { code: 'unauthorized', message: 'Sign in to continue.' } });
  });

  it('never shows another company', async () => {
    const res = await as.manager.get('/api/company');
    expect(res.status).toBe(200);
    expect(res.body.id).toBe(t.company.id);
    expect(res.body.today).toMatch(/^\d{4}-\d{2}-\d{2}$/);
  });
});

describe('row: company settings (owner only)', () => {
  it('saves the owner’s change, and the stored row and audit entry follow', async () => {
    const res = await as.owner.patch('/api/company').send({ phone: '555-0199', timeZone: 'America/Denver' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ phone: '555-0199', timeZone: 'America/Denver' });
    const [row] = await ctx.db.select().from(companies).where(eq(companies.id, t.company.id));
    expect(row).toMatchObject({ phone: '555-0199', timeZone: 'America/Denver' });
    const audits = await ctx.db.select().from(auditLog).where(eq(auditLog.entityId, t.company.id));
    expect(audits.some((a) => a.action === 'update' && a.actorId === t.owner.user.id)).toBe(true);
  });

  it('refuses a change that names no field with a form-level 400, writing nothing', async () => {
    const before = await ctx.db.select().from(auditLog).where(eq(auditLog.entityId, t.company.id));
    const res = await as.owner.patch('/api/company').send({});
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.details)).toEqual(['_']);
    expect(await ctx.db.select().from(auditLog).where(eq(auditLog.entityId, t.company.id))).toHaveLength(before.length);
  });

  it('refuses manager, technician and homeowner with 403', async () => {
    for (const agent of [as.manager, as.technician, as.homeowner]) {
      expect((await agent.patch('/api/company').send({ phone: '555-0100' })).status).toBe(403);
    }
    const [row] = await ctx.db.select().from(companies).where(eq(companies.id, t.company.id));
    expect(row.phone).not.toBe('555-0100');
  });

  it('answers a bad value with a field-level error', async () => {
    const res = await as.owner.patch('/api/company').send({ timeZone: 'Mars/Olympus', name: '' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.details).sort()).toEqual(['name', 'timeZone']);
  });
});

describe('row: invite members, change roles, deactivate', () => {
  it('lets a manager change a technician’s role but never an owner’s', async () => {
    const ok = await as.manager.patch(`/api/members/${t.technician.membership.id}`).send({ role: 'manager' });
    expect(ok.status).toBe(200);
    const [row] = await ctx.db.select().from(memberships).where(eq(memberships.id, t.technician.membership.id));
    expect(row.role).toBe('manager');
    await as.owner.patch(`/api/members/${t.technician.membership.id}`).send({ role: 'technician' }).expect(200);

    expect((await as.manager.patch(`/api/members/${t.owner.membership.id}`).send({ role: 'technician' })).status).toBe(403);
    expect((await as.manager.patch(`/api/members/${t.technician.membership.id}`).send({ role: 'owner' })).status).toBe(403);
  });

  it('refuses technicians and homeowners with 403', async () => {
    expect((await as.technician.patch(`/api/members/${t.manager.membership.id}`).send({ role: 'technician' })).status).toBe(403);
    expect((await as.homeowner.patch(`/api/members/${t.manager.membership.id}`).send({ role: 'technician' })).status).toBe(403);
  });

  it('answers 404 for a member of another company', async () => {
    const res = await as.owner.patch(`/api/members/${other.manager.membership.id}`).send({ role: 'technician' });
    expect(res.status).toBe(404);
    const [row] = await ctx.db.select().from(memberships).where(eq(memberships.id, other.manager.membership.id));
    expect(row.role).toBe('manager');
  });

  it('deactivating a member ends their sessions at once', async () => {
    const fresh = await createTenant(ctx.db);
    const owner = await signIn(app, fresh.owner.user.email);
    const tech = await signIn(app, fresh.technician.user.email);
    expect((await tech.get('/api/company')).status).toBe(200);

    const res = await owner.post(`/api/members/${fresh.technician.membership.id}/deactivate`);
    expect(res.status).toBe(200);
    expect(res.body.active).toBe(false);
    expect(await ctx.db.select().from(sessions).where(eq(sessions.userId, fresh.technician.user.id))).toHaveLength(0);
    expect((await tech.get('/api/company')).status).toBe(401);
  });
});

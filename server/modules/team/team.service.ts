import type { AppContext } from '../../context';
import { badRequest, forbidden, notFound } from '../../lib/http-error';
import { canManageMemberRole } from '../../../shared/policy';
import type { MemberDto } from '../../../shared/schemas/company';
import type { MemberRole, Principal } from '../../../shared/schemas/roles';
import { recordAudit } from '../../core/audit-log';
import { teamRepository } from './team.repository';

type Member = Extract<Principal, { kind: 'member' }>;
type Row = Awaited<ReturnType<typeof teamRepository.list>>[number];

const toDto = (r: Row): MemberDto => ({
  id: r.id,
  userId: r.userId,
  name: r.name,
  email: r.email,
  role: r.role,
  active: r.deactivatedAt === null,
});

export function teamService(ctx: AppContext) {
  async function findManageable(actor: Member, membershipId: string, newRole?: MemberRole) {
    const target = await teamRepository.find(ctx.db, actor.companyId, membershipId);
    if (!target) throw notFound('Member');
    if (target.userId === actor.userId) throw badRequest('You cannot change your own membership.');
    if (!canManageMemberRole(actor, target.role, newRole)) throw forbidden('Only an owner can change an owner or make someone an owner.');
    return target;
  }

  return {
    async list(companyId: string) {
      return (await teamRepository.list(ctx.db, companyId)).map(toDto);
    },
    async changeRole(actor: Member, membershipId: string, role: MemberRole) {
      await findManageable(actor, membershipId, role);
      await ctx.db.transaction(async (tx) => {
        await teamRepository.setRole(tx, actor.companyId, membershipId, role);
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'change_role', entity: 'membership', entityId: membershipId, changes: { role } });
      });
      return toDto((await teamRepository.find(ctx.db, actor.companyId, membershipId))!);
    },
    async deactivate(actor: Member, membershipId: string) {
      const target = await findManageable(actor, membershipId);
      await ctx.db.transaction(async (tx) => {
        await teamRepository.deactivate(tx, actor.companyId, membershipId, target.userId);
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'deactivate', entity: 'membership', entityId: membershipId });
      });
      return toDto((await teamRepository.find(ctx.db, actor.companyId, membershipId))!);
    },
  };
}

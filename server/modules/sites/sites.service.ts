import type { z } from 'zod';
import type { AppContext } from '../../context';
import type { DbOrTx } from '../../db/client';
import { notFound, validationFailed } from '../../lib/http-error';
import type { siteInput, sitePatch } from '../../../shared/schemas/records';
import type { Principal } from '../../../shared/schemas/roles';
import { recordAudit } from '../../core/audit-log';
import { findActiveMember, findCustomer } from '../../core/tenant-finders';
import { sitesRepository } from './sites.repository';

type Member = Extract<Principal, { kind: 'member' }>;

async function checkTechnician(db: DbOrTx, companyId: string, userId: string | null | undefined) {
  if (!userId) return;
  if (!(await findActiveMember(db, companyId, userId))) {
    throw validationFailed({ assignedTechnicianId: ['Pick a technician from your company.'] });
  }
}

export function sitesService(ctx: AppContext) {
  return {
    async create(actor: Member, input: z.output<typeof siteInput>) {
      return ctx.db.transaction(async (tx) => {
        if (!(await findCustomer(tx, actor.companyId, input.customerId))) {
          throw validationFailed({ customerId: ['Pick a customer of your company.'] });
        }
        await checkTechnician(tx, actor.companyId, input.assignedTechnicianId);
        const { id } = await sitesRepository.insert(tx, { ...input, companyId: actor.companyId, createdBy: actor.userId, updatedBy: actor.userId });
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'create', entity: 'site', entityId: id, changes: input });
        return (await sitesRepository.find(tx, actor.companyId, id))!;
      });
    },
    async update(actor: Member, id: string, input: z.output<typeof sitePatch>) {
      return ctx.db.transaction(async (tx) => {
        if (!(await sitesRepository.find(tx, actor.companyId, id))) throw notFound('Site');
        await checkTechnician(tx, actor.companyId, input.assignedTechnicianId);
        await sitesRepository.update(tx, actor.companyId, id, { ...input, updatedBy: actor.userId });
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'update', entity: 'site', entityId: id, changes: input });
        return (await sitesRepository.find(tx, actor.companyId, id))!;
      });
    },
  };
}

import type { AppContext } from '../../context';
import { notFound } from '../../lib/http-error';
import type { CatalogEntryDto } from '../../../shared/schemas/records';
import type { Principal } from '../../../shared/schemas/roles';
import { recordAudit } from '../../core/audit-log';
import { catalogRepository, type CatalogRow } from './catalog.repository';

type Member = Extract<Principal, { kind: 'member' }>;

const toDto = (r: CatalogRow): CatalogEntryDto => ({ code: r.code, group: r.group, label: r.label, specFields: r.specFields, active: r.active });

export function catalogService(ctx: AppContext) {
  return {
    async list(companyId: string) {
      return (await catalogRepository.list(ctx.db, companyId)).map(toDto);
    },
    async update(actor: Member, code: string, patch: { label?: string; active?: boolean }) {
      return ctx.db.transaction(async (tx) => {
        const row = await catalogRepository.update(tx, actor.companyId, code, { ...patch, updatedBy: actor.userId });
        if (!row) throw notFound('Part type');
        await recordAudit(tx, { companyId: actor.companyId, actorId: actor.userId, action: 'update', entity: 'component_catalog', entityId: code, changes: patch });
        return toDto(row);
      });
    },
  };
}

import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { changesQuery } from '../../../shared/schemas/changes';
import { changesService } from './changes.service';

/** Who changed what and why: the office's reading of the audit trail (owners and managers only). */
export function changesRoutes(ctx: AppContext) {
  const router = Router();
  const service = changesService(ctx);
  const access = { permission: 'records:history' } as const;
  defineRoute(router, 'get', '/appliances/:id/changes', { access, schemas: { params: uuidParam, query: changesQuery } }, ({ params, query }, _req, res) =>
    service.ofAppliance(currentMember(res).companyId, params.id, query),
  );
  defineRoute(router, 'get', '/visits/:id/changes', { access, schemas: { params: uuidParam, query: changesQuery } }, ({ params, query }, _req, res) =>
    service.ofVisit(currentMember(res).companyId, params.id, query),
  );
  return router;
}

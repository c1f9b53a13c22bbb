import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { checklistTemplateInput } from '../../../shared/schemas/records';
import { checklistsService } from './checklists.service';

export function checklistRoutes(ctx: AppContext) {
  const router = Router();
  const service = checklistsService(ctx);

  defineRoute(router, 'get', '/checklist-templates', { access: { permission: 'records:read' } }, (_i, _req, res) =>
    service.list(currentMember(res).companyId),
  );
  defineRoute(
    router,
    'put',
    '/checklist-templates/:id',
    { access: { permission: 'catalog:manage' }, schemas: { params: uuidParam, body: checklistTemplateInput } },
    ({ params, body }, _req, res) => service.replace(currentMember(res), params.id, body),
  );
  return router;
}

import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { memberRoleInput } from '../../../shared/schemas/company';
import { uuidParam } from '../../../shared/schemas/common';
import { teamService } from './team.service';

export function teamRoutes(ctx: AppContext) {
  const router = Router();
  const service = teamService(ctx);

  defineRoute(router, 'get', '/members', { access: { permission: 'records:read' } }, (_i, _req, res) =>
    service.list(currentMember(res).companyId),
  );
  defineRoute(
    router,
    'patch',
    '/members/:id',
    { access: { permission: 'team:manage' }, schemas: { params: uuidParam, body: memberRoleInput } },
    ({ params, body }, _req, res) => service.changeRole(currentMember(res), params.id, body.role),
  );
  defineRoute(
    router,
    'post',
    '/members/:id/deactivate',
    { access: { permission: 'team:manage' }, schemas: { params: uuidParam } },
    ({ params }, _req, res) => service.deactivate(currentMember(res), params.id),
  );
  return router;
}

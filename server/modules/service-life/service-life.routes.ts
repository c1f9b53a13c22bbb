import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { serviceLifeQuery } from '../../../shared/schemas/service-life';
import { serviceLifeService } from './service-life.service';

export function serviceLifeRoutes(ctx: AppContext) {
  const router = Router();
  const service = serviceLifeService(ctx);
  defineRoute(router, 'get', '/service-life', { access: { permission: 'records:read' }, schemas: { query: serviceLifeQuery } }, ({ query }, _req, res) =>
    service.estimates(currentMember(res).companyId, query.type),
  );
  defineRoute(
    router,
    'post',
    '/due-rules/:id/adopt-learned-life',
    { access: { permission: 'catalog:manage' }, schemas: { params: uuidParam } },
    ({ params }, _req, res) => service.adopt(currentMember(res), params.id),
  );
  return router;
}

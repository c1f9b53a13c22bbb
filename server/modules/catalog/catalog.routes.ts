import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { catalogCodeParam, catalogPatch } from '../../../shared/schemas/records';
import { catalogService } from './catalog.service';

export function catalogRoutes(ctx: AppContext) {
  const router = Router();
  const service = catalogService(ctx);

  defineRoute(router, 'get', '/catalog/component-types', { access: { permission: 'records:read' } }, (_i, _req, res) =>
    service.list(currentMember(res).companyId),
  );
  defineRoute(
    router,
    'patch',
    '/catalog/component-types/:code',
    { access: { permission: 'catalog:manage' }, schemas: { params: catalogCodeParam, body: catalogPatch } },
    ({ params, body }, _req, res) => service.update(currentMember(res), params.code, body),
  );
  return router;
}

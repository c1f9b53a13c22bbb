import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { makeupWaterEntryInput } from '../../../shared/schemas/makeup-water';
import { makeupWaterService } from './makeup-water.service';

export function makeupWaterRoutes(ctx: AppContext) {
  const router = Router();
  const service = makeupWaterService(ctx);
  defineRoute(router, 'get', '/appliances/:id/makeup-water', { access: { permission: 'records:read' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.get(currentMember(res).companyId, params.id),
  );
  defineRoute(
    router,
    'post',
    '/appliances/:id/makeup-water',
    { access: { permission: 'visits:record' }, schemas: { params: uuidParam, body: makeupWaterEntryInput }, status: 201 },
    ({ params, body }, _req, res) => service.add(currentMember(res), params.id, body),
  );
  return router;
}

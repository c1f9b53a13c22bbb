import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { radiationSurveyInput } from '../../../shared/schemas/radiation-surveys';
import { radiationSurveysService } from './radiation-surveys.service';

export function radiationSurveyRoutes(ctx: AppContext) {
  const router = Router();
  const service = radiationSurveysService(ctx);
  defineRoute(router, 'get', '/appliances/:id/radiation-surveys', { access: { permission: 'records:read' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.list(currentMember(res).companyId, params.id),
  );
  defineRoute(router, 'get', '/appliances/:id/radiation-surveys/latest', { access: { permission: 'records:read' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.latest(currentMember(res).companyId, params.id),
  );
  defineRoute(
    router,
    'post',
    '/appliances/:id/radiation-surveys',
    { access: { permission: 'records:write' }, schemas: { params: uuidParam, body: radiationSurveyInput }, status: 201 },
    ({ params, body }, _req, res) => service.create(currentMember(res), params.id, body),
  );
  return router;
}

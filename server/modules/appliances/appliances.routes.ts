import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { applianceInput, appliancePatch, componentInput, replaceApplianceInput, timelineQuery } from '../../../shared/schemas/records';
import { appliancesService } from './appliances.service';

export function applianceRoutes(ctx: AppContext) {
  const router = Router();
  const service = appliancesService(ctx);
  const read = { permission: 'records:read' } as const;
  const write = { permission: 'records:write' } as const;

  defineRoute(router, 'post', '/appliances', { access: write, schemas: { body: applianceInput }, status: 201 }, ({ body }, _req, res) =>
    service.create(currentMember(res), body),
  );
  defineRoute(router, 'get', '/appliances/:id', { access: read, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.get(currentMember(res).companyId, params.id),
  );
  defineRoute(router, 'patch', '/appliances/:id', { access: write, schemas: { params: uuidParam, body: appliancePatch } }, ({ params, body }, _req, res) =>
    service.update(currentMember(res), params.id, body),
  );
  defineRoute(
    router,
    'post',
    '/appliances/:id/replace',
    { access: write, schemas: { params: uuidParam, body: replaceApplianceInput } },
    ({ params, body }, _req, res) => service.replace(currentMember(res), params.id, body),
  );
  defineRoute(
    router,
    'post',
    '/appliances/:id/components',
    { access: write, schemas: { params: uuidParam, body: componentInput }, status: 201 },
    ({ params, body }, _req, res) => service.addComponent(currentMember(res), params.id, body),
  );
  defineRoute(
    router,
    'get',
    '/appliances/:id/timeline',
    { access: read, schemas: { params: uuidParam, query: timelineQuery } },
    ({ params, query }, _req, res) => service.timeline(currentMember(res).companyId, params.id, query),
  );
  return router;
}

import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { customerInput, customerListQuery, customerPatch } from '../../../shared/schemas/records';
import { customersService } from './customers.service';

export function customerRoutes(ctx: AppContext) {
  const router = Router();
  const service = customersService(ctx);

  defineRoute(router, 'get', '/customers', { access: { permission: 'records:read' }, schemas: { query: customerListQuery } }, ({ query }, _req, res) =>
    service.list(currentMember(res).companyId, query),
  );
  defineRoute(
    router,
    'post',
    '/customers',
    { access: { permission: 'records:write' }, schemas: { body: customerInput }, status: 201 },
    ({ body }, _req, res) => service.create(currentMember(res), body),
  );
  defineRoute(router, 'get', '/customers/:id', { access: { permission: 'records:read' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.get(currentMember(res).companyId, params.id),
  );
  defineRoute(
    router,
    'patch',
    '/customers/:id',
    { access: { permission: 'records:write' }, schemas: { params: uuidParam, body: customerPatch } },
    ({ params, body }, _req, res) => service.update(currentMember(res), params.id, body),
  );
  return router;
}

import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { dueQuery, dueRuleInput, dueStockQuery } from '../../../shared/schemas/due';
import { dueService } from './due.service';

export function dueRoutes(ctx: AppContext) {
  const router = Router();
  const service = dueService(ctx);

  defineRoute(router, 'get', '/due-rules', { access: { permission: 'records:read' } }, (_i, _req, res) =>
    service.listRules(currentMember(res).companyId),
  );
  defineRoute(
    router,
    'put',
    '/due-rules/:id',
    { access: { permission: 'catalog:manage' }, schemas: { params: uuidParam, body: dueRuleInput } },
    ({ params, body }, _req, res) => service.updateRule(currentMember(res), params.id, body),
  );
  defineRoute(router, 'get', '/due', { access: { permission: 'records:read' }, schemas: { query: dueQuery } }, ({ query }, _req, res) =>
    service.listDue(currentMember(res).companyId, query),
  );
  defineRoute(router, 'get', '/due/stock', { access: { permission: 'records:read' }, schemas: { query: dueStockQuery } }, ({ query }, _req, res) =>
    service.stock(currentMember(res).companyId, query.withinDays),
  );
  return router;
}

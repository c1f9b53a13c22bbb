import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { dueQuery, dueRuleInput, dueStockQuery } from '../../../shared/schemas/due';
import { dueService } from './due.service';
import { dueItemsToCsv } from './due-csv';

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
  defineRoute(router, 'get', '/due/export.csv', { access: { permission: 'records:read' }, schemas: { query: dueQuery } }, async ({ query }, _req, res) => {
    const { after: _after, limit: _limit, ...filters } = query;
    const csv = dueItemsToCsv(await service.exportAll(currentMember(res).companyId, filters));
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="due-list-next-${query.withinDays}-days.csv"`);
    // A byte-order mark so spreadsheet programs read the UTF-8 names correctly.
    res.send(`\uFEFF${csv}`);
  });
  defineRoute(router, 'get', '/due/stock', { access: { permission: 'records:read' }, schemas: { query: dueStockQuery } }, ({ query }, _req, res) =>
    service.stock(currentMember(res).companyId, query.withinDays),
  );
  return router;
}

import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { fleetService } from './fleet.service';
import { annualServiceDueQuery, replacementProspectsQuery } from '../../../shared/schemas/fleet';

export function fleetRoutes(ctx: AppContext) {
  const router = Router();
  const service = fleetService(ctx);
  defineRoute(
    router,
    'get',
    '/fleet/annual-service-due',
    { access: { permission: 'records:read' }, schemas: { query: annualServiceDueQuery } },
    ({ query }, _req, res) => {
      return service.annualServiceDue(currentMember(res).companyId, query);
    },
  );
  defineRoute(
    router,
    'get',
    '/fleet/replacement-prospects',
    { access: { permission: 'records:read' }, schemas: { query: replacementProspectsQuery } },
    ({ query }, _req, res) => {
      return service.replacementProspects(currentMember(res).companyId, query);
    },
  );
  return router;
}

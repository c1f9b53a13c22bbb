import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { companySettingsInput } from '../../../shared/schemas/company';
import { companyService } from './company.service';

export function companyRoutes(ctx: AppContext) {
  const router = Router();
  const service = companyService(ctx);

  defineRoute(router, 'get', '/company', { access: { permission: 'records:read' } }, (_i, _req, res) =>
    service.get(currentMember(res).companyId),
  );

  defineRoute(
    router,
    'patch',
    '/company',
    { access: { permission: 'company:settings' }, schemas: { body: companySettingsInput } },
    ({ body }, _req, res) => {
      const me = currentMember(res);
      return service.update(me.companyId, me.userId, body);
    },
  );
  return router;
}

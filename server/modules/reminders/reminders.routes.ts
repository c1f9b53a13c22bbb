import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { reminderApplianceParams, remindersListQuery, unsubscribeParams } from '../../../shared/schemas/reminders';
import { remindersService } from './reminders.service';
import { unsubscribeService } from './unsubscribe.service';

export function remindersRoutes(ctx: AppContext) {
  const router = Router();
  const service = remindersService(ctx);
  const unsubscribe = unsubscribeService(ctx);

  defineRoute(
    router,
    'post',
    '/reminders/annual-service/:applianceId',
    { access: { permission: 'reminders:send' }, schemas: { params: reminderApplianceParams }, status: 201 },
    ({ params }, _req, res) => service.sendAnnualFromOffice(currentMember(res), params.applianceId),
  );
  defineRoute(router, 'get', '/reminders', { access: { permission: 'records:read' }, schemas: { query: remindersListQuery } }, ({ query }, _req, res) =>
    service.list(currentMember(res).companyId, query),
  );
  // Opened from the e-mail without signing in; the signed token is the only key.
  defineRoute(router, 'get', '/unsubscribe/:token', { access: 'public', schemas: { params: unsubscribeParams } }, ({ params }) =>
    unsubscribe.status(params.token),
  );
  // RFC 8058 one-click: mail programs POST "List-Unsubscribe=One-Click" here; the page's button posts here too.
  defineRoute(router, 'post', '/unsubscribe/:token', { access: 'public', schemas: { params: unsubscribeParams } }, ({ params }) =>
    unsubscribe.optOut(params.token),
  );
  return router;
}

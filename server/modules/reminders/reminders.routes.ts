import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { FORM_BODY, JSON_BODY, MULTIPART_BODY } from '../../middleware/body-type';
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
  // RFC 8058 one-click: mail programs POST "List-Unsubscribe=One-Click" here as a form (multipart or urlencoded);
  // the page's button posts here too. The body is not read: the token alone says who opts out.
  defineRoute(
    router,
    'post',
    '/unsubscribe/:token',
    { access: 'public', schemas: { params: unsubscribeParams }, bodyTypes: [JSON_BODY, FORM_BODY, MULTIPART_BODY] },
    ({ params }) => unsubscribe.optOut(params.token),
  );
  return router;
}

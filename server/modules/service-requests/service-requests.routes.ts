import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentHomeowner, currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { shareTokenParam } from '../../../shared/schemas/homeowner';
import { serviceRequestInput, serviceRequestListQuery, serviceRequestPatch } from '../../../shared/schemas/service-requests';
import { requireOwnAppliance } from '../homeowner';
import { resolveShareToken } from '../share-links';
import { serviceRequestsService } from './service-requests.service';

export function serviceRequestRoutes(ctx: AppContext) {
  const router = Router();
  const service = serviceRequestsService(ctx);

  // The token is the capability: the same 404/410 as opening the page, and a daily limit per link.
  defineRoute(
    router,
    'post',
    '/share/:token/service-requests',
    { access: 'public', schemas: { params: shareTokenParam, body: serviceRequestInput }, status: 201 },
    async ({ params, body }) => {
      const link = await resolveShareToken(ctx.db, params.token);
      return service.create({ companyId: link.companyId, applianceId: link.applianceId, via: 'share_link', shareLinkId: link.id }, body);
    },
  );
  defineRoute(
    router,
    'post',
    '/homeowner/appliances/:id/service-requests',
    { access: 'homeowner', schemas: { params: uuidParam, body: serviceRequestInput }, status: 201 },
    async ({ params, body }, _req, res) => {
      const me = currentHomeowner(res);
      await requireOwnAppliance(ctx, me, params.id);
      return service.create({ companyId: me.companyId, applianceId: params.id, via: 'homeowner_account', requesterUserId: me.userId }, body);
    },
  );
  defineRoute(router, 'get', '/service-requests', { access: { permission: 'records:read' }, schemas: { query: serviceRequestListQuery } }, ({ query }, _req, res) =>
    service.list(currentMember(res), query),
  );
  defineRoute(
    router,
    'patch',
    '/service-requests/:id',
    { access: { permission: 'records:write' }, schemas: { params: uuidParam, body: serviceRequestPatch } },
    ({ params, body }, _req, res) => service.setStatus(currentMember(res), params.id, body.status),
  );
  return router;
}

import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { shareLinkInput, shareTokenParam } from '../../../shared/schemas/homeowner';
import { shareLinksService } from './share-links.service';

export function shareLinkRoutes(ctx: AppContext) {
  const router = Router();
  const service = shareLinksService(ctx);
  defineRoute(
    router,
    'post',
    '/appliances/:id/share-links',
    { access: { permission: 'share:create' }, schemas: { params: uuidParam, body: shareLinkInput }, status: 201 },
    ({ params, body }, _req, res) => service.create(currentMember(res), params.id, body),
  );
  defineRoute(router, 'get', '/appliances/:id/share-links', { access: { permission: 'records:read' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.list(currentMember(res), params.id),
  );
  defineRoute(router, 'post', '/share-links/:id/revoke', { access: { permission: 'share:revoke' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.revoke(currentMember(res), params.id),
  );
  defineRoute(router, 'get', '/share/:token', { access: 'public', schemas: { params: shareTokenParam } }, ({ params }, _req, res) => {
    // A capability page: never indexed, never cached by anyone but the holder's browser.
    res.setHeader('X-Robots-Tag', 'noindex, nofollow');
    res.setHeader('Cache-Control', 'private, no-store');
    return service.open(params.token);
  });
  return router;
}

import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { siteInput, sitePatch } from '../../../shared/schemas/records';
import { sitesService } from './sites.service';

export function siteRoutes(ctx: AppContext) {
  const router = Router();
  const service = sitesService(ctx);

  defineRoute(
    router,
    'post',
    '/sites',
    { access: { permission: 'records:write' }, schemas: { body: siteInput }, status: 201 },
    ({ body }, _req, res) => service.create(currentMember(res), body),
  );
  defineRoute(
    router,
    'patch',
    '/sites/:id',
    { access: { permission: 'records:write' }, schemas: { params: uuidParam, body: sitePatch } },
    ({ params, body }, _req, res) => service.update(currentMember(res), params.id, body),
  );
  return router;
}

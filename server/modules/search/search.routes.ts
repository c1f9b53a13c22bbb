import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentMember } from '../../middleware/authenticate';
import { searchQuery } from '../../../shared/schemas/records';
import { searchService } from './search.service';

export function searchRoutes(ctx: AppContext) {
  const router = Router();
  const service = searchService(ctx);

  defineRoute(router, 'get', '/search', { access: { permission: 'records:read' }, schemas: { query: searchQuery } }, ({ query }, _req, res) =>
    service.search(currentMember(res).companyId, query.q),
  );
  return router;
}

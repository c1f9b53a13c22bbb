import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentHomeowner } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { LABELS } from '../../../shared/schemas/enums';
import type { HomeownerApplianceSummary } from '../../../shared/schemas/homeowner';
import { buildHomeownerView } from './homeowner-view';
import { ownAppliances, requireOwnAppliance } from './own-appliance';

export function homeownerRoutes(ctx: AppContext) {
  const router = Router();
  defineRoute(router, 'get', '/homeowner/appliances', { access: 'homeowner' }, async (_i, _req, res): Promise<HomeownerApplianceSummary[]> => {
    const me = currentHomeowner(res);
    const rows = await ownAppliances(ctx, me);
    return rows.map((r) => ({ id: r.id, title: `${LABELS.applianceKind[r.kind]}, ${LABELS.fuel[r.fuel].toLowerCase()}`, address: `${r.street}, ${r.town}` }));
  });
  defineRoute(router, 'get', '/homeowner/appliances/:id', { access: 'homeowner', schemas: { params: uuidParam } }, async ({ params }, _req, res) => {
    const me = currentHomeowner(res);
    await requireOwnAppliance(ctx, me, params.id);
    return buildHomeownerView(ctx.db, me.companyId, params.id);
  });
  return router;
}

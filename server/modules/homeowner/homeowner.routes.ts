import { Router } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentHomeowner } from '../../middleware/authenticate';
import { notFound } from '../../lib/http-error';
import { uuidParam } from '../../../shared/schemas/common';
import { LABELS } from '../../../shared/schemas/enums';
import type { HomeownerApplianceSummary } from '../../../shared/schemas/homeowner';
import { buildHomeownerView } from './homeowner-view';
import { homeownerRepository } from './homeowner.repository';

export function homeownerRoutes(ctx: AppContext) {
  const router = Router();
  defineRoute(router, 'get', '/homeowner/appliances', { access: 'homeowner' }, async (_i, _req, res): Promise<HomeownerApplianceSummary[]> => {
    const me = currentHomeowner(res);
    const rows = await homeownerRepository.appliancesOfCustomers(ctx.db, me.companyId, me.customerIds);
    return rows.map((r) => ({ id: r.id, title: `${LABELS.applianceKind[r.kind]}, ${LABELS.fuel[r.fuel].toLowerCase()}`, address: `${r.street}, ${r.town}` }));
  });
  defineRoute(router, 'get', '/homeowner/appliances/:id', { access: 'homeowner', schemas: { params: uuidParam } }, async ({ params }, _req, res) => {
    const me = currentHomeowner(res);
    const own = await homeownerRepository.appliancesOfCustomers(ctx.db, me.companyId, me.customerIds);
    // Someone else's appliance answers exactly like one that does not exist.
    if (!own.some((a) => a.id === params.id)) throw notFound('Appliance');
    return buildHomeownerView(ctx.db, me.companyId, params.id);
  });
  return router;
}

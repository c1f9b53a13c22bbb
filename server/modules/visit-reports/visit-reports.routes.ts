import { Router, type Response } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentHomeowner, currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { homeownerVisitParams, shareVisitParams } from '../../../shared/schemas/homeowner';
import { requireOwnAppliance } from '../homeowner';
import { visitReportsService, type ReportPdf } from './visit-reports.service';

export function sendPdf(res: Response, { pdf, filename }: ReportPdf) {
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
  res.setHeader('Cache-Control', 'private, no-store');
  res.end(Buffer.from(pdf));
}

/** The one-page visit report: for the office, the homeowner signed in, and whoever holds the share link. */
export function visitReportRoutes(ctx: AppContext) {
  const router = Router();
  const service = visitReportsService(ctx);
  defineRoute(router, 'get', '/visits/:id/report', { access: { permission: 'records:read' }, schemas: { params: uuidParam } }, async ({ params }, _req, res) =>
    sendPdf(res, await service.forMember(currentMember(res), params.id)),
  );
  defineRoute(router, 'post', '/visits/:id/report/email', { access: { permission: 'share:create' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.email(currentMember(res), params.id),
  );
  defineRoute(router, 'get', '/share/:token/visits/:visitId/report', { access: 'public', schemas: { params: shareVisitParams } }, async ({ params }, _req, res) => {
    res.setHeader('X-Robots-Tag', 'noindex, nofollow');
    sendPdf(res, await service.forShareToken(params.token, params.visitId));
  });
  defineRoute(
    router,
    'get',
    '/homeowner/appliances/:id/visits/:visitId/report',
    { access: 'homeowner', schemas: { params: homeownerVisitParams } },
    async ({ params }, _req, res) => {
      const me = currentHomeowner(res);
      await requireOwnAppliance(ctx, me, params.id);
      sendPdf(res, await service.forAppliance(me.companyId, params.id, params.visitId));
    },
  );
  return router;
}

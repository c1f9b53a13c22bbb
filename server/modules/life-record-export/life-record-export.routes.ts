import { Router, type Response } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { currentHomeowner, currentMember } from '../../middleware/authenticate';
import { uuidParam } from '../../../shared/schemas/common';
import { shareTokenParam } from '../../../shared/schemas/homeowner';
import { requireOwnAppliance } from '../homeowner';
import { resolveShareToken } from '../share-links';
import { sendPdf } from '../visit-reports';
import { buildLifeRecordExport, type ExportAudience } from './build-export';
import { renderLifeRecordPdf, thumbnailForPdf } from './life-record-pdf';

type Where = { companyId: string; applianceId: string; audience: ExportAudience };

/** The whole life record as JSON (docs/schemas/life-record-export.v1.json) or as PDF, for the office, the homeowner and the share link. */
export function lifeRecordExportRoutes(ctx: AppContext) {
  const router = Router();

  async function json(res: Response, at: Where) {
    const { document } = await buildLifeRecordExport(ctx.db, at.companyId, at.applianceId, at.audience);
    res.setHeader('Content-Disposition', `attachment; filename="life-record-${document.exportedAt.slice(0, 10)}.json"`);
    res.setHeader('Cache-Control', 'private, no-store');
    return document;
  }

  async function pdf(res: Response, at: Where) {
    const { document, photoFiles } = await buildLifeRecordExport(ctx.db, at.companyId, at.applianceId, at.audience);
    const photos = [];
    for (const p of photoFiles) {
      const object = await ctx.storage.get(p.thumbKey).catch((err: unknown) => {
        if ((err as { name?: string }).name === 'NoSuchKey') return null;
        throw err;
      });
      photos.push({ jpeg: object ? await thumbnailForPdf(object.body) : null, caption: `${p.kind.replace(/_/g, ' ')}, ${p.takenOn}${p.caption ? `: ${p.caption}` : ''}` });
    }
    sendPdf(res, { pdf: await renderLifeRecordPdf(document, photos), filename: `life-record-${document.exportedAt.slice(0, 10)}.pdf` });
  }

  const office = (res: Response, id: string): Where => ({ companyId: currentMember(res).companyId, applianceId: id, audience: 'office' });
  defineRoute(router, 'get', '/appliances/:id/life-record.json', { access: { permission: 'records:read' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    json(res, office(res, params.id)),
  );
  defineRoute(router, 'get', '/appliances/:id/life-record.pdf', { access: { permission: 'records:read' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    pdf(res, office(res, params.id)),
  );

  async function own(res: Response, id: string): Promise<Where> {
    const me = currentHomeowner(res);
    await requireOwnAppliance(ctx, me, id);
    return { companyId: me.companyId, applianceId: id, audience: 'homeowner' };
  }
  defineRoute(router, 'get', '/homeowner/appliances/:id/life-record.json', { access: 'homeowner', schemas: { params: uuidParam } }, async ({ params }, _req, res) =>
    json(res, await own(res, params.id)),
  );
  defineRoute(router, 'get', '/homeowner/appliances/:id/life-record.pdf', { access: 'homeowner', schemas: { params: uuidParam } }, async ({ params }, _req, res) =>
    pdf(res, await own(res, params.id)),
  );

  async function shared(res: Response, token: string): Promise<Where> {
    const link = await resolveShareToken(ctx.db, token);
    res.setHeader('X-Robots-Tag', 'noindex, nofollow');
    return { companyId: link.companyId, applianceId: link.applianceId, audience: 'share' };
  }
  defineRoute(router, 'get', '/share/:token/life-record.json', { access: 'public', schemas: { params: shareTokenParam } }, async ({ params }, _req, res) =>
    json(res, await shared(res, params.token)),
  );
  defineRoute(router, 'get', '/share/:token/life-record.pdf', { access: 'public', schemas: { params: shareTokenParam } }, async ({ params }, _req, res) =>
    pdf(res, await shared(res, params.token)),
  );
  return router;
}

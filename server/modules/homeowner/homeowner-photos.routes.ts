import { Router, type Request, type Response } from 'express';
import type { AppContext } from '../../context';
import { defineRoute } from '../../lib/route';
import { notFound } from '../../lib/http-error';
import { currentHomeowner } from '../../middleware/authenticate';
import { HOMEOWNER_PHOTO_VARIANTS, homeownerPhotoParams, sharePhotoParams, type HomeownerPhotoVariant } from '../../../shared/schemas/homeowner';
import { photosService, sendPhoto } from '../photos';
import { resolveShareToken } from '../share-links';
import { requireOwnAppliance } from './own-appliance';

const isVariant = (v: string): v is HomeownerPhotoVariant => (HOMEOWNER_PHOTO_VARIANTS as readonly string[]).includes(v);

/** Photo bytes for the homeowner: only the given appliance's photos marked for them; anything else is 404. */
export function homeownerPhotoRoutes(ctx: AppContext) {
  const router = Router();

  const photos = photosService(ctx);

  async function send(req: Request, res: Response, at: { companyId: string; applianceId: string }, photoId: string, variant: string) {
    if (!isVariant(variant)) throw notFound('Photo');
    const image = await photos.homeownerImage(at, photoId, variant);
    // Private, and revalidated each time, so a photo hidden later or a link revoked stops showing at once (a 304 is cheap).
    res.setHeader('Referrer-Policy', 'no-referrer');
    await sendPhoto(req, res, image, 'private, no-cache');
  }

  defineRoute(router, 'get', '/share/:token/photos/:photoId/:variant', { access: 'public', schemas: { params: sharePhotoParams } }, async ({ params }, req, res) => {
    const link = await resolveShareToken(ctx.db, params.token);
    res.setHeader('X-Robots-Tag', 'noindex, nofollow');
    await send(req, res, link, params.photoId, params.variant);
  });
  defineRoute(
    router,
    'get',
    '/homeowner/appliances/:id/photos/:photoId/:variant',
    { access: 'homeowner', schemas: { params: homeownerPhotoParams } },
    async ({ params }, req, res) => {
      const me = currentHomeowner(res);
      await requireOwnAppliance(ctx, me, params.id);
      await send(req, res, { companyId: me.companyId, applianceId: params.id }, params.photoId, params.variant);
    },
  );
  return router;
}

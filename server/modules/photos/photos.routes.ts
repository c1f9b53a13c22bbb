import { Router } from 'express';
import multer, { MulterError } from 'multer';
import type { AppContext } from '../../context';
import { HttpError } from '../../lib/http-error';
import { defineRoute, reply } from '../../lib/route';
import { currentMember, requirePermission } from '../../middleware/authenticate';
import { MULTIPART_BODY } from '../../middleware/body-type';
import { uuidParam } from '../../../shared/schemas/common';
import { MAX_PHOTO_BYTES, MAX_PHOTO_FILES, photoListQuery, photoPatch, photoUploadFields } from '../../../shared/schemas/photos';
import { photosService, type PhotoVariant } from './photos.service';
import { sendPhoto } from './send-photo';

export function photosRoutes(ctx: AppContext) {
  const router = Router();
  const service = photosService(ctx);
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_PHOTO_BYTES, files: MAX_PHOTO_FILES, fields: 20, fieldSize: 8 * 1024, parts: MAX_PHOTO_FILES + 20 },
  });

  const readUpload = upload.array('files', MAX_PHOTO_FILES);
  // The multipart body is read only after the caller's role is checked, so a stranger cannot make us buffer 250 MB.
  router.post('/photos', requirePermission('visits:record'), (req, res, next) =>
    // The parser's own errors ("Malformed part header", "Unexpected end of form") are plain Errors: the form is bad.
    readUpload(req, res, (err?: unknown) => next(err && !(err instanceof MulterError) ? malformedUpload() : err)),
  );
  defineRoute(
    router,
    'post',
    '/photos',
    { access: { permission: 'visits:record' }, schemas: { body: photoUploadFields }, bodyTypes: [MULTIPART_BODY] },
    async ({ body }, req, res) => {
      const files = Array.isArray(req.files) ? req.files : [];
      const { result, created } = await service.upload(currentMember(res), body, files);
      return reply(created ? 201 : 200, result);
    },
  );
  defineRoute(router, 'get', '/photos', { access: { permission: 'records:read' }, schemas: { query: photoListQuery } }, ({ query }, _req, res) =>
    service.list(currentMember(res), query.applianceId),
  );
  for (const variant of ['display', 'thumb'] as const satisfies PhotoVariant[]) {
    defineRoute(router, 'get', `/photos/:id/${variant}`, { access: 'signed-in', schemas: { params: uuidParam } }, async ({ params }, req, res) => {
      const image = await service.image(res.locals.principal, params.id, variant);
      // Served from our own origin with a private cache: the bytes of one photo never change under its id.
      await sendPhoto(req, res, image, 'private, max-age=86400');
    });
  }
  defineRoute(router, 'patch', '/photos/:id', { access: { permission: 'records:write' }, schemas: { params: uuidParam, body: photoPatch } }, ({ params, body }, _req, res) =>
    service.update(currentMember(res), params.id, body),
  );
  return router;
}

const malformedUpload = () => new HttpError(400, 'upload_rejected', 'The upload could not be read: send it again as a multipart form.');


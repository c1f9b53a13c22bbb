import { Router } from 'express';
import multer, { MulterError } from 'multer';
import type { AppContext } from '../../context';
import { HttpError } from '../../lib/http-error';
import { defineRoute, reply } from '../../lib/route';
import { currentMember, requirePermission } from '../../middleware/authenticate';
import { MULTIPART_BODY } from '../../middleware/body-type';
import { uuidParam } from '../../../shared/schemas/common';
import { importMappingInput, MAX_IMPORT_BYTES } from '../../../shared/schemas/imports';
import { importsService } from './imports.service';

const tooLarge = () =>
  new HttpError(413, 'import_file_rejected', `The file is larger than ${MAX_IMPORT_BYTES / 2 ** 20} MB. Split it into smaller files.`, {
    file: [`The file is larger than ${MAX_IMPORT_BYTES / 2 ** 20} MB. Split it into smaller files.`],
  });

export function importRoutes(ctx: AppContext) {
  const router = Router();
  const service = importsService(ctx);
  const readUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_IMPORT_BYTES, files: 1, fields: 5, parts: 6 } }).single('file');

  // The body is read only after the role is checked, so a stranger cannot make us buffer 20 MB.
  router.post('/imports', requirePermission('records:import'), (req, res, next) =>
    readUpload(req, res, (err?: unknown) => {
      if (err instanceof MulterError && err.code === 'LIMIT_FILE_SIZE') return next(tooLarge());
      if (err && !(err instanceof MulterError)) return next(new HttpError(400, 'upload_rejected', 'The upload could not be read: send it again as a multipart form.'));
      next(err);
    }),
  );
  defineRoute(router, 'post', '/imports', { access: { permission: 'records:import' }, status: 201, bodyTypes: [MULTIPART_BODY] }, (_input, req, res) =>
    service.upload(currentMember(res), req.file),
  );
  defineRoute(router, 'get', '/imports', { access: { permission: 'records:import' } }, (_input, _req, res) => service.list(currentMember(res).companyId));
  defineRoute(router, 'get', '/imports/:id', { access: { permission: 'records:import' }, schemas: { params: uuidParam } }, ({ params }, _req, res) =>
    service.get(currentMember(res).companyId, params.id),
  );
  defineRoute(
    router,
    'post',
    '/imports/:id/preview',
    { access: { permission: 'records:import' }, schemas: { params: uuidParam, body: importMappingInput } },
    ({ params, body }, _req, res) => service.preview(currentMember(res), params.id, body),
  );
  defineRoute(
    router,
    'post',
    '/imports/:id/run',
    { access: { permission: 'records:import' }, schemas: { params: uuidParam, body: importMappingInput } },
    async ({ params, body }, _req, res) => {
      const file = await service.run(currentMember(res), params.id, body);
      // 200 when a small file was imported within the request; 202 while a large one runs on (poll GET /imports/:id).
      return reply(file.status === 'queued' || file.status === 'importing' ? 202 : 200, file);
    },
  );
  defineRoute(router, 'get', '/imports/:id/errors.csv', { access: { permission: 'records:import' }, schemas: { params: uuidParam } }, async ({ params }, _req, res) => {
    const { fileName, csv } = await service.errorsCsv(currentMember(res).companyId, params.id);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName.replace(/["\\\r\n]/g, '_')}"`);
    // A byte-order mark so spreadsheets open the UTF-8 file as UTF-8.
    res.send(`\uFEFF${csv}`);
  });
  return router;
}

import type { ErrorRequestHandler, RequestHandler } from 'express';
import { MulterError } from 'multer';
import { HttpError } from '../lib/http-error';
import { RETRY_AFTER_SECONDS, unavailableMessage, unavailableService } from '../lib/unavailable';

export const notFoundApi: RequestHandler = (_req, _res, next) => next(new HttpError(404, 'not_found', 'No such API route.'));

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let status = 500;
  let body: { code: string; message: string; details?: unknown; files?: unknown } = { code: 'internal', message: 'Something went wrong on our side.' };
  if (err instanceof HttpError) {
    status = err.status;
    body = { code: err.code, message: err.message, ...(err.details ? { details: err.details } : {}), ...(err.files ? { files: err.files } : {}) };
  } else if (err instanceof MulterError) {
    status = err.code === 'LIMIT_FILE_SIZE' ? 413 : 400;
    body = { code: 'upload_rejected', message: err.message, details: err.field ? { [err.field]: [err.message] } : undefined };
  } else if (err?.type === 'entity.parse.failed') {
    status = 400;
    body = { code: 'bad_json', message: 'The request body is not valid JSON.' };
  } else if (err?.type === 'entity.too.large') {
    status = 413;
    body = { code: 'too_large', message: 'The request body is too large.' };
  } else if (Number.isInteger(err?.status) && err.status >= 400 && err.status < 500) {
    status = err.status;
    body = { code: 'http_error', message: err.expose ? err.message : 'The request was not accepted.' };
  } else {
    const service = unavailableService(err);
    if (service) {
      // An outage, not a bug: the client waits and tries again.
      req.log?.warn({ err, service }, 'a service is unavailable');
      res.setHeader('Retry-After', String(RETRY_AFTER_SECONDS));
      res.status(503).json({ error: { code: 'unavailable', message: unavailableMessage(service) } });
      return;
    }
  }
  if (status >= 500) req.log?.error({ err }, 'request failed');
  res.status(status).json({ error: body });
};

import type { FileRejection } from '../../shared/schemas/errors';

export type ErrorDetails = Record<string, string[]> | Record<string, unknown>;

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: ErrorDetails,
    /** Refused uploads, each with its file name and the reason (see shared/schemas/errors.ts). */
    readonly files?: FileRejection[],
  ) {
    super(message);
  }
}

export const badRequest = (message: string, details?: ErrorDetails) => new HttpError(400, 'bad_request', message, details);
export const validationFailed = (details: ErrorDetails) =>
  new HttpError(400, 'validation_failed', 'Some fields need attention.', details);
export const unauthorized = () => new HttpError(401, 'unauthorized', 'Sign in to continue.');
export const forbidden = (message = 'Your role does not allow this.') => new HttpError(403, 'forbidden', message);
export const notFound = (what = 'Record') => new HttpError(404, 'not_found', `${what} not found.`);
export const conflict = (message: string, details?: ErrorDetails) => new HttpError(409, 'conflict', message, details);
export const gone = (message: string) => new HttpError(410, 'gone', message);

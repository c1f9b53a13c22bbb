/**
 * The one error shape every API route answers with: `{ error: { code, message, details?, files? } }`.
 * `details` holds messages by field path ("components.2.installedOn"); a message about the request as a whole
 * (an empty patch, nothing to correct) sits under FORM_ERROR_KEY. `files` names each refused upload with its reason.
 */
export const FORM_ERROR_KEY = '_';

export type FieldErrors = Record<string, string[]>;
export type FileRejection = { file: string; reason: string };
export type ErrorBody = { error: { code: string; message: string; details?: FieldErrors; files?: FileRejection[] } };

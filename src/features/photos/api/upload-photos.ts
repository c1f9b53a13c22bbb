import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ApiError } from '@/lib/api-client';
import type { ErrorBody } from '@shared/schemas/errors';
import { MAX_PHOTO_BYTES, type PhotoKind, type PhotoUploadDto } from '@shared/schemas/photos';
import { applianceKeys } from '@/lib/resources/appliances';

/** One file of a batch and the name it is sent under (unique within the batch, so a rejection names exactly one file). */
export type UploadItem = { file: File; name: string };
export type UploadBatch = { applianceId: string; visitId?: string; kind: PhotoKind; caption: string; items: UploadItem[] };
/** 201 when anything was new; 200 when every file was already on the record (the server dedupes by SHA-256). */
export type UploadResult = { status: number; photos: PhotoUploadDto['photos'] };

const OFFLINE = 'No connection. The photos are kept on this phone; try again when you have signal.';
const TOO_LARGE = `A photo is too large: the limit is ${MAX_PHOTO_BYTES / 1024 / 1024} MB each.`;

function failure(status: number, body: unknown): ApiError {
  const err = (body as Partial<ErrorBody> | null)?.error;
  // A 413 may come from a proxy with an HTML body, and multer's own says only "File too large": say it in our words.
  if (status === 413) return new ApiError(413, 'too_large', TOO_LARGE);
  return new ApiError(status, err?.code ?? 'http_error', err?.message ?? `The photos were not saved (${status}).`, err?.details, undefined, err?.files);
}

/**
 * POST /api/photos as multipart with XMLHttpRequest rather than fetch, because only XHR reports upload progress
 * (fetch has no upload progress events in browsers today).
 */
export function sendPhotos(batch: UploadBatch, onProgress: (percent: number) => void, signal?: AbortSignal): Promise<UploadResult> {
  const form = new FormData();
  form.append('applianceId', batch.applianceId);
  if (batch.visitId) form.append('visitId', batch.visitId);
  form.append('kind', batch.kind);
  if (batch.caption.trim()) form.append('caption', batch.caption.trim());
  for (const item of batch.items) form.append('files', item.file, item.name);

  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/photos');
    xhr.responseType = 'json';
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) onProgress(Math.min(100, Math.round((e.loaded / e.total) * 100)));
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress(100);
        resolve({ status: xhr.status, photos: (xhr.response as PhotoUploadDto).photos });
      } else {
        reject(failure(xhr.status, xhr.response));
      }
    };
    xhr.onerror = () => reject(new ApiError(0, 'offline', OFFLINE));
    xhr.onabort = () => reject(new ApiError(0, 'aborted', 'Sending was stopped. The photos are kept on this phone.'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

export function useUploadPhotos(applianceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ batch, onProgress, signal }: { batch: UploadBatch; onProgress: (percent: number) => void; signal?: AbortSignal }) =>
      sendPhotos(batch, onProgress, signal),
    // The photo list, the record and its timeline (a "photo added" entry) all change.
    onSettled: () => qc.invalidateQueries({ queryKey: applianceKeys.record(applianceId) }),
  });
}

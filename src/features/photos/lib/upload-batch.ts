import { MAX_PHOTO_BYTES, PHOTO_KIND_LABELS, type PhotoDto, type PhotoKind } from '@shared/schemas/photos';
import type { ApiError } from '@/lib/api-client';
import type { UploadItem, UploadResult } from '../api/upload-photos';

/** A file the server (or this phone, for size) would not take, with the reason in plain words. */
export type Rejection = { name: string; message: string };

/** Phones often call every picked photo "image.jpg": give repeats a number so each rejection points at one file. */
export function namedUniquely(files: File[]): UploadItem[] {
  const used = new Set<string>();
  return files.map((file) => {
    const original = file.name || 'photo.jpg';
    let name = original;
    for (let n = 2; used.has(name); n++) {
      const dot = original.lastIndexOf('.');
      name = dot > 0 ? `${original.slice(0, dot)} (${n})${original.slice(dot)}` : `${original} (${n})`;
    }
    used.add(name);
    return { file, name };
  });
}

/** Files over the server's limit are refused here, before any bytes are sent over a weak signal. */
export function splitOversized(items: UploadItem[]): { fits: UploadItem[]; rejected: Rejection[] } {
  const limitMb = MAX_PHOTO_BYTES / 1024 / 1024;
  return {
    fits: items.filter((i) => i.file.size <= MAX_PHOTO_BYTES),
    rejected: items.filter((i) => i.file.size > MAX_PHOTO_BYTES).map((i) => ({ name: i.name, message: `This photo is larger than ${limitMb} MB.` })),
  };
}

/** The server names each refused file with its reason (`error.files`); match it to the file sent under that name. */
export function rejectionsFrom(error: Pick<ApiError, 'files' | 'details'>, items: UploadItem[]): { rejected: Rejection[]; other: string[] } {
  const rejected: Rejection[] = [];
  const other: string[] = [];
  for (const { file, reason } of error.files ?? []) {
    if (items.some((i) => i.name === file)) rejected.push({ name: file, message: reason });
    else other.push(`${file}: ${reason}`);
  }
  // A message about the files as a whole ("Add at least one photo.") names no file.
  if (!error.files?.length) other.push(...(error.details?.files ?? []));
  return { rejected, other };
}

/** "2 photos saved." / "Already saved: …" / a mix of both. */
export function savedSummary(result: UploadResult): string {
  const already = result.photos.filter((p) => p.duplicate).length;
  const saved = result.photos.length - already;
  const photos = (n: number) => `${n} photo${n === 1 ? '' : 's'}`;
  if (result.status === 200 || saved === 0) return `Already saved: ${already === 1 ? 'this photo was' : 'these photos were'} on the record already.`;
  return already ? `${photos(saved)} saved; ${already} already on the record.` : `${photos(saved)} saved.`;
}

/** The first photo of an appliance is usually its nameplate; after that, findings. */
export const defaultKind = (photos: PhotoDto[] | undefined): PhotoKind => (photos?.some((p) => p.kind === 'nameplate') ? 'finding' : 'nameplate');

export const photoAlt = (p: Pick<PhotoDto, 'caption' | 'kind'>) => p.caption || `${PHOTO_KIND_LABELS[p.kind]} photo`;

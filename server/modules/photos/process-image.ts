import crypto from 'node:crypto';
import sharp, { type Metadata } from 'sharp';
import { HttpError } from '../../lib/http-error';

/** Above any phone's full-resolution photo, far below sharp's default of about 268 megapixels. */
export const MAX_INPUT_PIXELS = 60_000_000;
export const DISPLAY_MAX_PX = 1600;
export const THUMB_MAX_PX = 320;
const ACCEPTED = new Set(['jpeg', 'png', 'webp']);

export type ProcessedImage = {
  sha256: string;
  width: number;
  height: number;
  display: { body: Buffer; width: number; height: number; contentType: 'image/jpeg' };
  thumb: { body: Buffer; width: number; height: number; contentType: 'image/jpeg' };
};

const rejected = (message: string) => new HttpError(422, 'image_rejected', message, { file: [message] });

/**
 * Proves the upload is an image by decoding it, applies the EXIF orientation and drops all metadata (GPS included:
 * a homeowner's location must not leak), then makes a display size and a thumbnail.
 */
export async function processImage(input: Buffer): Promise<ProcessedImage> {
  const sha256 = crypto.createHash('sha256').update(input).digest('hex');
  let meta: Metadata;
  try {
    meta = await sharp(input, { limitInputPixels: MAX_INPUT_PIXELS }).metadata();
  } catch (err) {
    if (/pixel limit/i.test(String((err as Error).message))) throw rejected('This image has too many pixels (over 60 megapixels).');
    throw rejected('This file is not an image we can read. Send a JPEG, PNG or WebP photo.');
  }
  if (meta.format === 'heif') throw rejected('HEIC photos cannot be read by this server yet. Set the camera to "Most compatible" (JPEG) and try again.');
  if (!meta.format || !ACCEPTED.has(meta.format)) throw rejected('Send a JPEG, PNG or WebP photo.');
  if ((meta.width ?? 0) * (meta.height ?? 0) > MAX_INPUT_PIXELS) throw rejected('This image has too many pixels (over 60 megapixels).');

  const render = async (max: number, quality: number) => {
    try {
      // failOn 'truncated' rejects a cut-off upload instead of storing a half-grey picture.
      const { data, info } = await sharp(input, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'truncated' })
        .rotate()
        .resize({ width: max, height: max, fit: 'inside', withoutEnlargement: true })
        .jpeg({ quality, mozjpeg: false })
        .toBuffer({ resolveWithObject: true });
      return { body: data, width: info.width, height: info.height, contentType: 'image/jpeg' as const };
    } catch {
      throw rejected('This image is damaged or incomplete. Take the photo again.');
    }
  };
  const [display, thumb] = await Promise.all([render(DISPLAY_MAX_PX, 82), render(THUMB_MAX_PX, 74)]);
  const rotated = (meta.orientation ?? 1) >= 5;
  return { sha256, width: rotated ? meta.height! : meta.width!, height: rotated ? meta.width! : meta.height!, display, thumb };
}

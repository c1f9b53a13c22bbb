import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { DISPLAY_MAX_PX, processImage, THUMB_MAX_PX } from '../../../server/modules/photos/process-image';
import { exifHasGpsPointer, phoneJpegWithGps, pixelFloodPng } from '../../support/images';

describe('processImage', () => {
  it('applies the EXIF orientation and strips every piece of metadata, GPS included', async () => {
    const input = await phoneJpegWithGps(640, 480);
    const inputMeta = await sharp(input).metadata();
    expect(inputMeta.orientation).toBe(6);
    expect(exifHasGpsPointer(inputMeta.exif)).toBe(true);
    const out = await processImage(input);
    // Orientation 6 means the picture is really 480 wide and 640 tall.
    expect([out.width, out.height]).toEqual([480, 640]);
    for (const variant of [out.display, out.thumb]) {
      const meta = await sharp(variant.body).metadata();
      expect(meta.exif).toBeUndefined();
      expect(meta.orientation).toBeUndefined();
      expect(exifHasGpsPointer(variant.body)).toBe(false);
      expect(meta.height).toBeGreaterThan(meta.width!);
    }
    expect(out.thumb.height).toBe(THUMB_MAX_PX);
    expect(out.sha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it('shrinks a large photo to the display size without enlarging small ones', async () => {
    const big = await sharp({ create: { width: 4000, height: 3000, channels: 3, background: '#888' } }).jpeg().toBuffer();
    const out = await processImage(big);
    expect(out.display.width).toBe(DISPLAY_MAX_PX);
    const small = await sharp({ create: { width: 200, height: 100, channels: 3, background: '#888' } }).png().toBuffer();
    expect((await processImage(small)).display.width).toBe(200);
  });

  it('rejects a text file, a truncated JPEG and a pixel flood with a clear 422', async () => {
    const jpeg = await phoneJpegWithGps(1200, 900);
    const cases: [string, Buffer, RegExp][] = [
      ['text renamed .jpg', Buffer.from('this is not a photo of a boiler'), /not an image we can read/],
      ['truncated JPEG', jpeg.subarray(0, Math.floor(jpeg.length / 2)), /damaged or incomplete/],
      ['pixel flood', pixelFloodPng(), /too many pixels/],
    ];
    for (const [, buf, message] of cases) {
      await expect(processImage(buf)).rejects.toMatchObject({ status: 422, code: 'image_rejected', message: expect.stringMatching(message) });
    }
  });
});

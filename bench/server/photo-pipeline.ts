import crypto from 'node:crypto';
import sharp from 'sharp';
import { processImage } from '../../server/modules/photos/process-image';
import type { ObjectStorage } from '../../server/lib/object-storage';

/**
 * A 12-megapixel camera-like JPEG (4000 × 3000): blurred noise, so it carries detail like a photo instead of
 * compressing to nothing the way a flat colour would.
 */
export async function twelveMegapixelJpeg(): Promise<Buffer> {
  return sharp({ create: { width: 4000, height: 3000, channels: 3, background: { r: 120, g: 110, b: 100 }, noise: { type: 'gaussian', mean: 120, sigma: 40 } } })
    .blur(1.2)
    .jpeg({ quality: 90 })
    .toBuffer();
}

/** Milliseconds for what an upload costs the server: decode and resize (processImage), then both S3 puts. */
export async function timePhotoPipeline(storage: ObjectStorage, jpeg: Buffer, runs: number): Promise<number[]> {
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const start = performance.now();
    const image = await processImage(jpeg);
    const base = `bench/${crypto.randomUUID()}`;
    await storage.put(`${base}-display.jpg`, image.display.body, image.display.contentType);
    await storage.put(`${base}-thumb.jpg`, image.thumb.body, image.thumb.contentType);
    times.push(performance.now() - start);
  }
  return times;
}

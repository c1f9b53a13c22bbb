import type { AppContext } from '../../context';
import { photosRepository as repo } from './photos.repository';

const CHUNK = 500;
/** Photo objects live under <company id>/<appliance id>/; the bucket holds other things too (imports/), swept by their own job. */
const PHOTO_KEY = /^[0-9a-f-]{36}\/[0-9a-f-]{36}\//;

/**
 * Deletes stored objects that no photo row points at. An upload stores its objects before the row is written,
 * so only objects older than `olderThanHours` are touched: a younger one may belong to an upload still in flight.
 */
export async function sweepOrphanObjects(
  ctx: Pick<AppContext, 'db' | 'storage'>,
  options: { olderThanHours: number; now?: Date; prefix?: string },
): Promise<{ deleted: string[] }> {
  const cutoff = (options.now ?? new Date()).getTime() - options.olderThanHours * 3_600_000;
  const old = (await ctx.storage.list(options.prefix ?? '')).filter((o) => PHOTO_KEY.test(o.key) && o.lastModified.getTime() < cutoff).map((o) => o.key);
  const deleted: string[] = [];
  for (let i = 0; i < old.length; i += CHUNK) {
    const keys = old.slice(i, i + CHUNK);
    const referenced = await repo.referencedKeys(ctx.db, keys);
    for (const key of keys) {
      if (referenced.has(key)) continue;
      await ctx.storage.delete(key);
      deleted.push(key);
    }
  }
  return { deleted };
}

import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildClientIfStale } from '../../scripts/lib/client-build';
import { PROJECT_ROOT } from '../../scripts/lib/paths';
import { BUNDLE_BUDGETS_KB, measureRouteBundles, officeScreensOutsideEntry, type RouteBundle } from '../../bench/client/bundle';

// A size budget, not a timing: the gzip bytes of every JS chunk a route loads, read from the production build's manifest.
const clientDir = process.env.LIFEPLATE_TEST_CLIENT_DIR ?? path.join(PROJECT_ROOT, '.data', 'test-client');
let bundles: Map<string, RouteBundle>;

beforeAll(async () => {
  await buildClientIfStale(clientDir, { quiet: true });
  bundles = new Map(measureRouteBundles(clientDir).map((b) => [b.route, b]));
});

const kb = (bytes: number) => `${(bytes / 1024).toFixed(1)} KB`;

describe('client bundle budget (gzip)', () => {
  it.each([
    ['tag', '/t/:code'],
    ['share', '/s/:token'],
    ['my-appliance', '/my/:id'],
    ['record', '/appliances/:id'],
  ])('%s page (%s) stays within its budget', (route) => {
    const b = bundles.get(route)!;
    const budget = BUNDLE_BUDGETS_KB[route] * 1024;
    expect(b.jsFiles.length).toBeGreaterThan(2);
    expect(b.jsGzipBytes, `${route}: ${kb(b.jsGzipBytes)} over ${kb(budget)} in ${b.jsFiles.join(', ')}`).toBeLessThanOrEqual(budget);
  });

  it('keeps the schema library and the office screens off the tag and homeowner pages', () => {
    for (const route of ['tag', 'share', 'my-appliance']) {
      const files = bundles.get(route)!.jsFiles;
      expect(files.filter((f) => /\/(schemas|zod|customers-page|due-list-page|catalog-page|team-page)-/.test(f)), route).toEqual([]);
    }
  });

  it('gives every office screen a chunk of its own, outside the entry', () => {
    expect(officeScreensOutsideEntry(clientDir).notSplit).toEqual([]);
  });
});

import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { CLIENT_ROUTES } from '../../server/spa/route-chunks';
import { visits } from '../../server/db/schema/index';
import { insertAppliance, insertSite } from '../../server/db/factories/records';
import { testContext } from '../support/context';
import { agentsFor, createTenant, type Tenant } from '../support/tenant';

/** A stand-in client build: index.html as Vite writes it, a manifest naming every routed module, a few assets. */
function fakeClientBuild(): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-client-html-'));
  fs.mkdirSync(path.join(dir, 'assets'));
  fs.mkdirSync(path.join(dir, '.vite'));
  fs.writeFileSync(
    path.join(dir, 'index.html'),
    '<!doctype html><html lang="en"><head><meta charset="UTF-8" /><title>Lifeplate</title>' +
      '<script type="module" crossorigin src="/assets/index-t.js"></script><link rel="modulepreload" crossorigin href="/assets/vendor-t.js"></head>' +
      '<body class="bg-plate text-iron"><div id="root"></div></body></html>',
  );
  const manifest: Record<string, object> = {
    'index.html': { file: 'assets/index-t.js', isEntry: true, imports: ['_vendor-t.js'] },
    '_vendor-t.js': { file: 'assets/vendor-t.js' },
    'node_modules/@fontsource/source-sans-3/files/source-sans-3-latin-700-normal.woff2': { file: 'assets/latin-700-t.woff2' },
  };
  for (const route of CLIENT_ROUTES) {
    for (const key of route.modules) manifest[key] = { file: `assets/${path.basename(key, '.tsx')}-t.js`, isDynamicEntry: true, imports: ['_vendor-t.js'] };
  }
  fs.writeFileSync(path.join(dir, '.vite', 'manifest.json'), JSON.stringify(manifest));
  // Big enough (over 1 KB) for the compression middleware to gzip it.
  fs.writeFileSync(path.join(dir, 'assets', 'vendor-t.js'), `export const v = ${JSON.stringify('lifeplate '.repeat(400))};\n`);
  fs.writeFileSync(path.join(dir, 'assets', 'index-t.js'), 'import "./vendor-t.js";\n');
  return dir;
}

const clientDir = fakeClientBuild();
const ctx = testContext();
const app = createApp(ctx, { clientDir });
let t: Tenant;
let other: Tenant;
let as: Awaited<ReturnType<typeof agentsFor>>;
let otherManager: Awaited<ReturnType<typeof agentsFor>>['manager'];
let boilerId: string;
const STREET = '41 Tollgate Rise';
const SECRET_NOTE = 'Office only: gate code 4471';
// Text that would end a script element early if it were not escaped.
const HOSTILE_FINDINGS = 'Flue checked </script><script>alert(1)</script><!-- ok';

beforeAll(async () => {
  t = await createTenant(ctx.db);
  other = await createTenant(ctx.db);
  as = await agentsFor(app, t);
  otherManager = (await agentsFor(app, other)).manager;
  const site = await insertSite(ctx.db, { companyId: t.company.id, customerId: t.customer.id, street: STREET, town: 'Wrenfield' });
  boilerId = (await insertAppliance(ctx.db, { companyId: t.company.id, siteId: site.id, kind: 'steam_boiler', fuel: 'natural_gas' })).id;
  await ctx.db.insert(visits).values({
    companyId: t.company.id,
    applianceId: boilerId,
    type: 'annual_maintenance',
    status: 'completed',
    visitedOn: '2026-10-20',
    findings: HOSTILE_FINDINGS,
    internalNotes: SECRET_NOTE,
    outcome: 'left_operating',
    completedAt: new Date('2026-10-20T15:00:00Z'),
  });
});
afterAll(async () => {
  await ctx.pool.end();
  fs.rmSync(clientDir, { recursive: true, force: true });
});

const PRELOAD = /<script type="application\/json" id="lp-preload">([\s\S]*?)<\/script>/;
type Preload = { queries: { key: unknown[]; data: unknown }[] };
const preloadOf = (html: string): Preload | null => {
  const m = PRELOAD.exec(html);
  return m ? (JSON.parse(m[1]) as Preload) : null;
};
const tokenOf = (url: string) => url.split('/s/')[1];
/** What the server put inside `<div id="root">`, with React's text separators (`<!-- -->`) taken out. */
const rootMarkupOf = (html: string): string => {
  const m = /<div id="root">([\s\S]*?)<\/div>(?:<script type="application\/json"|<\/body>)/.exec(html);
  if (!m) throw new Error('no root element in the page');
  return m[1].replaceAll('<!-- -->', '');
};

async function makeShareLink() {
  const made = await as.manager.post(`/api/appliances/${boilerId}/share-links`).send({});
  expect(made.status).toBe(201);
  return { id: made.body.id as string, token: tokenOf(made.body.url as string) };
}

describe('share page HTML', () => {
  it('embeds exactly what GET /api/share/:token answers, escaped, with noindex, no-store and no referrer', async () => {
    const { token } = await makeShareLink();
    const res = await request(app).get(`/s/${token}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.headers['cache-control']).toContain('no-store');
    expect(res.headers['x-robots-tag']).toBe('noindex, nofollow');
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['content-security-policy']).toContain("script-src 'self';");

    const api = await request(app).get(`/api/share/${token}`);
    expect(api.status).toBe(200);
    expect(preloadOf(res.text)).toEqual({ queries: [{ key: ['share', token], data: api.body }] });
    // The hostile findings arrive intact as data but never as markup: the only script elements are the page's own.
    expect(JSON.stringify(api.body)).toContain(HOSTILE_FINDINGS);
    expect(res.text).not.toContain('</script><script>alert(1)');
    expect(res.text).not.toContain('<!-- ok');
    expect(res.text).not.toContain(SECRET_NOTE);
    // The route's chunk and the heading's font are hinted so they load with the HTML, not after the entry runs.
    expect(res.text).toContain('<link rel="modulepreload" crossorigin href="/assets/share-page-t.js">');
    expect(res.text).toContain('<link rel="preload" href="/assets/latin-700-t.woff2" as="font" type="font/woff2" crossorigin>');
  });

  it('carries the first screen rendered from the same data inside #root, with the findings as text, not markup', async () => {
    const { token } = await makeShareLink();
    const [res, api] = await Promise.all([request(app).get(`/s/${token}`), request(app).get(`/api/share/${token}`)]);
    expect(api.status).toBe(200);
    const root = rootMarkupOf(res.text);
    expect(root).toContain('<h1 class="text-2xl font-bold">Your steam boiler, natural gas</h1>');
    expect(root).toContain(STREET);
    const [visit] = api.body.visits as { what: string }[];
    expect(root).toContain(`October 20, 2026 · ${visit.what}`);
    expect(root).toContain('Flue checked &lt;/script&gt;&lt;script&gt;alert(1)&lt;/script&gt;&lt;!-- ok');
    expect(root).not.toContain('<script');
    expect(root).not.toContain(SECRET_NOTE);
    // Until the script has loaded, the request form cannot be filled in or sent (a native submit would lose it).
    expect(root).toMatch(/<input[^>]*name="contactName"/);
    for (const input of root.match(/<input[^>]*>/g) ?? []) expect(input).toContain('disabled=""');
    expect(root).toMatch(/<button type="submit"[^>]*disabled=""/);
  });

  it('embeds nothing about the appliance for a revoked, unknown or malformed token', async () => {
    const { id, token } = await makeShareLink();
    expect((await as.manager.post(`/api/share-links/${id}/revoke`)).status).toBe(200);
    const unknown = 'A'.repeat(43);
    for (const path of [`/s/${token}`, `/s/${unknown}`, '/s/not-a-token']) {
      const res = await request(app).get(path);
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toContain('no-store');
      expect(res.headers['x-robots-tag']).toBe('noindex, nofollow');
      expect(res.text).not.toContain('lp-preload');
      expect(rootMarkupOf(res.text)).toBe('');
      for (const secret of [STREET, t.company.name, 'Flue checked', SECRET_NOTE, boilerId]) expect(res.text).not.toContain(secret);
    }
  });
});

describe('record HTML', () => {
  it("embeds the signed-in technician's /api/me and /api/appliances/:id answers", async () => {
    const res = await as.technician.get(`/appliances/${boilerId}`);
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toContain('no-store');
    const [me, record] = await Promise.all([as.technician.get('/api/me'), as.technician.get(`/api/appliances/${boilerId}`)]);
    expect(record.status).toBe(200);
    expect(preloadOf(res.text)).toEqual({
      queries: [
        { key: ['me'], data: me.body },
        { key: ['appliance', boilerId], data: record.body },
      ],
    });
    expect(res.text).toContain('<link rel="modulepreload" crossorigin href="/assets/appliance-record-page-t.js">');
    expect(res.text).toContain('<link rel="modulepreload" crossorigin href="/assets/signed-in-layout-t.js">');
  });

  it('embeds nothing for a signed-out request or a homeowner, and no record for another company', async () => {
    for (const agent of [as.anonymous, as.homeowner]) {
      const res = await agent.get(`/appliances/${boilerId}`);
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toContain('no-store');
      expect(res.text).not.toContain('lp-preload');
      expect(rootMarkupOf(res.text)).toBe('');
      expect(res.text).not.toContain(STREET);
    }
    // Another company's manager gets their own /api/me, and the record's API answers them 404: so nothing of it here.
    expect((await otherManager.get(`/api/appliances/${boilerId}`)).status).toBe(404);
    const res = await otherManager.get(`/appliances/${boilerId}`);
    const preload = preloadOf(res.text);
    expect(preload?.queries.map((q) => q.key)).toEqual([['me']]);
    for (const secret of [STREET, t.company.name, 'Flue checked']) expect(res.text).not.toContain(secret);
  });
});

describe('static client', () => {
  it('caches hashed assets for a year as immutable, gzips them, and answers a missing one 404 rather than HTML', async () => {
    const asset = await request(app).get('/assets/vendor-t.js').set('Accept-Encoding', 'gzip');
    expect(asset.status).toBe(200);
    expect(asset.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(asset.headers['content-encoding']).toBe('gzip');
    expect(asset.text).toContain('lifeplate lifeplate');

    const missing = await request(app).get('/assets/old-chunk-x.js');
    expect(missing.status).toBe(404);
    expect(missing.text).not.toContain('<div id="root">');
  });

  it('serves other paths the page with their chunk hinted, revalidated on each visit, and never the manifest', async () => {
    const tag = await request(app).get('/t/ABCD-1234').set('Accept-Encoding', 'gzip');
    expect(tag.status).toBe(200);
    expect(tag.headers['cache-control']).toBe('no-cache');
    expect(tag.text).toContain('<link rel="modulepreload" crossorigin href="/assets/tag-landing-page-t.js">');
    expect(tag.text).not.toContain('lp-preload');

    const manifest = await request(app).get('/.vite/manifest.json');
    expect(manifest.text).not.toContain('isDynamicEntry');
  });
});

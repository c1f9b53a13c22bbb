import path from 'node:path';
import express, { Router, type Request, type Response } from 'express';
import type { AppContext } from '../context';
import { HttpError } from '../lib/http-error';
import { loadSession } from '../middleware/authenticate';
import { appliancesService } from '../modules/appliances';
import { describeMe } from '../modules/me';
import { shareLinksService } from '../modules/share-links';
import { can } from '../../shared/policy';
import { uuidParam } from '../../shared/schemas/common';
import { shareTokenParam } from '../../shared/schemas/homeowner';
import { indexHtmlRenderer } from './index-html';
import { preloadKeys, preloadScriptTag, type PreloadedQuery } from './preload';
import { matchClientRoute } from './route-chunks';
import { sharePageMarkup } from './share-page-markup';

/**
 * The built client: hashed assets cached for a year, and index.html for every other path, with modulepreload hints
 * for the route's chunks. The share page and the record also carry their first screen's data, fetched with the same
 * services and the same access rules as their API routes, so nothing is embedded that the API would not answer;
 * the share page's first screen is also rendered into the HTML.
 */
export function serveClient(ctx: AppContext, clientDir: string) {
  const router = Router();
  const render = indexHtmlRenderer(clientDir);
  const shareLinks = shareLinksService(ctx);
  const appliances = appliancesService(ctx);

  // Hashed assets never change under the same name, so they may be cached for a year. A missing one is a 404,
  // never index.html (a stale tab asking for an old chunk must fail as a script, not parse HTML).
  router.use('/assets', express.static(path.join(clientDir, 'assets'), { immutable: true, maxAge: '1y', index: false }), (_req, res) => {
    res.status(404).end();
  });
  // The service worker, its manifest and the shell it precaches are checked on every visit, so a deploy reaches
  // installed phones on their next start (the worker itself then offers "reload" to the technician).
  const alwaysRevalidate = new Set(['sw.js', 'manifest.webmanifest', 'index.html']);
  router.use(
    express.static(clientDir, {
      index: false,
      maxAge: '1h',
      setHeaders: (res, file) => {
        if (alwaysRevalidate.has(path.basename(file))) res.setHeader('Cache-Control', 'no-cache');
      },
    }),
  );

  /** Data the API would refuse (404, 410, 401, 403) is simply left out; the page then asks the API and shows why. */
  async function orNothing<T>(load: () => Promise<T>): Promise<T | undefined> {
    try {
      return await load();
    } catch (err) {
      if (!(err instanceof HttpError)) ctx.logger.warn({ err }, 'first-screen data not embedded');
      return undefined;
    }
  }

  const sendHtml = (req: Request, res: Response, queries: PreloadedQuery[] = [], rootMarkup = '') => {
    res.type('html').send(render(matchClientRoute(req.path)?.route ?? null, preloadScriptTag(queries), rootMarkup));
  };

  // The "this time does not suit me" page of a booking e-mail: a capability page like the share page.
  router.get('/booking-reply/:token', (req, res) => {
    res.setHeader('X-Robots-Tag', 'noindex, nofollow');
    res.setHeader('Cache-Control', 'private, no-store');
    sendHtml(req, res);
  });

  router.get('/s/:token', async (req, res) => {
    // A capability page: never indexed, never stored by anyone but the holder's browser.
    res.setHeader('X-Robots-Tag', 'noindex, nofollow');
    res.setHeader('Cache-Control', 'private, no-store');
    const params = shareTokenParam.safeParse(req.params);
    const token = params.success ? params.data.token : null;
    const view = token ? await orNothing(() => shareLinks.open(token)) : undefined;
    if (!token || !view) return sendHtml(req, res);
    // Painted from the HTML, before the script arrives: the page's largest text does not wait for React.
    sendHtml(req, res, [{ key: preloadKeys.share(token), data: view }], sharePageMarkup(token, view, ctx.logger));
  });

  router.get('/appliances/:id', loadSession(ctx), async (req, res) => {
    res.setHeader('Cache-Control', 'private, no-store');
    const principal = res.locals.principal;
    const params = uuidParam.safeParse(req.params);
    const queries: PreloadedQuery[] = [];
    // The same rule as GET /api/appliances/:id: a member with records:read, looked up within their own company.
    if (res.locals.session && principal?.kind === 'member' && can(principal, 'records:read') && params.success) {
      const [me, record] = await Promise.all([orNothing(() => describeMe(ctx, res)), orNothing(() => appliances.get(principal.companyId, params.data.id))]);
      if (me) queries.push({ key: preloadKeys.me(), data: me });
      if (record) queries.push({ key: preloadKeys.applianceRecord(params.data.id), data: record });
    }
    sendHtml(req, res, queries);
  });

  router.get('/{*splat}', (req, res) => {
    res.setHeader('Cache-Control', 'no-cache');
    sendHtml(req, res);
  });
  return router;
}

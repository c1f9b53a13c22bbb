import fs from 'node:fs';
import path from 'node:path';
import express, { Router } from 'express';
import { bookingRoutes } from './modules/bookings/bookings.routes';
import { bookingReplyRoutes } from './modules/booking-notices/booking-reply.routes';
import compression from 'compression';
import { toNodeHandler } from 'better-auth/node';
import type { ViteDevServer } from 'vite';
import type { AppContext } from './context';
import { securityHeaders } from './security-headers';
import { requestLogger } from './logger';
import { CLIENT_IP_HEADER } from './auth/auth';
import { loadSession } from './middleware/authenticate';
import { provideIdempotencyStore } from './lib/idempotency/idempotency-middleware';
import { sameOriginOnly } from './middleware/same-origin';
import { errorHandler, notFoundApi } from './middleware/error-handler';
import { healthRoutes } from './routes/health';
import { meRoutes } from './modules/me/me.routes';
import { companyRoutes } from './modules/company/company.routes';
import { teamRoutes } from './modules/team/team.routes';
import { searchRoutes } from './modules/search/search.routes';
import { customerRoutes } from './modules/customers/customers.routes';
import { siteRoutes } from './modules/sites/sites.routes';
import { applianceRoutes } from './modules/appliances/appliances.routes';
import { catalogRoutes } from './modules/catalog/catalog.routes';
import { checklistRoutes } from './modules/checklists/checklists.routes';
import { changesRoutes } from './modules/audit/changes.routes';
import { visitsRoutes } from './modules/visits/visits.routes';
import { dueRoutes } from './modules/due/due.routes';
import { makeupWaterRoutes } from './modules/makeup-water/makeup-water.routes';
import { radiationSurveyRoutes } from './modules/radiation-surveys/radiation-surveys.routes';
import { shareLinkRoutes } from './modules/share-links/share-links.routes';
import { recordTransferRoutes } from './modules/record-transfers/record-transfers.routes';
import { homeownerRoutes } from './modules/homeowner/homeowner.routes';
import { fleetRoutes } from './modules/fleet/fleet.routes';
import { serviceLifeRoutes } from './modules/service-life/service-life.routes';
import { tagsRoutes } from './modules/tags/tags.routes';
import { photosRoutes } from './modules/photos/photos.routes';
import { invitationRoutes } from './modules/invitations/invitations.routes';
import { serveClient } from './spa/serve-client';
import { robotsTxt } from './spa/robots';
import { remindersRoutes } from './modules/reminders/reminders.routes';
import { outboxRoutes } from './modules/reminders/outbox.routes';
import { homeownerPhotoRoutes } from './modules/homeowner/homeowner-photos.routes';
import { importRoutes } from './modules/imports/imports.routes';
import { serviceRequestRoutes } from './modules/service-requests/service-requests.routes';
import { visitReportRoutes } from './modules/visit-reports/visit-reports.routes';
import { lifeRecordExportRoutes } from './modules/life-record-export/life-record-export.routes';

export type AppOptions = {
  /** Built client (vite build output) to serve; omitted in API-only tests. */
  clientDir?: string;
  /** Vite in middleware mode, for `npm run dev`. */
  vite?: ViteDevServer;
};

export function createApp(ctx: AppContext, options: AppOptions = {}) {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', parseTrustProxy(ctx.config.TRUST_PROXY));
  app.use(requestLogger(ctx.logger, ctx.config.LOG_FORMAT));
  app.use(securityHeaders(ctx.config, { dev: Boolean(options.vite) }));
  // gzip for HTML, JS, CSS and JSON on a phone's weak signal; images and PDFs are already compressed and pass as they are.
  app.use(compression());

  // better-auth reads the raw body itself, so it is mounted before express.json().
  app.all('/api/auth/*splat', (req, _res, next) => {
    req.headers[CLIENT_IP_HEADER] = req.ip ?? '';
    next();
  }, toNodeHandler(ctx.auth));

  const api = Router();
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  // Before the body is read: a foreign page's request is refused without parsing what it sent.
  api.use(sameOriginOnly(ctx.config.BASE_URL));
  api.use(express.json({ limit: '1mb' }));
  api.use(healthRoutes(ctx));
  api.use(loadSession(ctx));
  api.use(provideIdempotencyStore(ctx.db));
  api.use(meRoutes(ctx));
  api.use(companyRoutes(ctx));
  api.use(teamRoutes(ctx));
  api.use(searchRoutes(ctx));
  api.use(customerRoutes(ctx));
  api.use(siteRoutes(ctx));
  api.use(applianceRoutes(ctx));
  api.use(catalogRoutes(ctx));
  api.use(checklistRoutes(ctx));
  api.use(visitsRoutes(ctx));
  api.use(changesRoutes(ctx));
  api.use(visitReportRoutes(ctx));
  api.use(lifeRecordExportRoutes(ctx));
  api.use(dueRoutes(ctx));
  api.use(makeupWaterRoutes(ctx));
  api.use(radiationSurveyRoutes(ctx));
  api.use(shareLinkRoutes(ctx));
  api.use(recordTransferRoutes(ctx));
  api.use(homeownerRoutes(ctx));
  api.use(fleetRoutes(ctx));
  api.use(serviceLifeRoutes(ctx));
  api.use(tagsRoutes(ctx));
  api.use(photosRoutes(ctx));
  api.use(invitationRoutes(ctx));
  api.use(remindersRoutes(ctx));
  api.use(outboxRoutes(ctx));
  api.use(homeownerPhotoRoutes(ctx));
  api.use(serviceRequestRoutes(ctx));
  api.use(importRoutes(ctx));
  api.use(bookingRoutes(ctx));
  api.use(bookingReplyRoutes(ctx));
  api.use(notFoundApi);
  app.use('/api', api);

  // Before the client, whose fallback would answer index.html for it.
  app.get('/robots.txt', robotsTxt);
  if (options.vite) {
    app.use(options.vite.middlewares);
  } else if (options.clientDir && fs.existsSync(path.join(options.clientDir, 'index.html'))) {
    app.use(serveClient(ctx, options.clientDir));
  }

  app.use(errorHandler);
  return app;
}

function parseTrustProxy(value: string): boolean | number | string {
  if (value === 'true' || value === 'false') return value === 'true';
  return /^\d+$/.test(value) ? Number(value) : value;
}

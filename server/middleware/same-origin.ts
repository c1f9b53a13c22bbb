import type { RequestHandler } from 'express';
import { HttpError } from '../lib/http-error';

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
/** Fetch Metadata values that mean the request came from our own pages (or the user's own navigation). */
const OWN_FETCH_SITES = new Set(['same-origin', 'none']);

/**
 * Routes a foreign page may post to: each needs no cookie (its token is the only key), so a cross-site request can do
 * nothing its sender could not do directly. RFC 8058's one-click unsubscribe is posted by mail programs by design.
 */
const CROSS_SITE_ALLOWED = [/^\/unsubscribe\/[^/]+$/];

/**
 * The second line of defence against cross-site request forgery beside SameSite cookies (OWASP ASVS 5.0, V3):
 * a state-changing request whose Origin (or, without one, Sec-Fetch-Site) names another site is refused with 403.
 * Browsers send one or both on every state-changing request, so a request with neither did not come from a web
 * page (curl, a mail program, supertest) and passes; so does a route in CROSS_SITE_ALLOWED.
 */
export function sameOriginOnly(baseUrl: string): RequestHandler {
  const ownOrigin = new URL(baseUrl).origin;
  return (req, _res, next) => {
    if (!STATE_CHANGING.has(req.method) || CROSS_SITE_ALLOWED.some((path) => path.test(req.path))) return next();
    const origin = req.headers.origin;
    const fetchSite = req.headers['sec-fetch-site'];
    const foreign = origin !== undefined ? origin !== ownOrigin : fetchSite !== undefined && !OWN_FETCH_SITES.has(String(fetchSite));
    if (!foreign) return next();
    next(new HttpError(403, 'foreign_origin', 'This request came from another site, so it was refused. Open Lifeplate itself and try again.'));
  };
}

import type { RequestHandler } from 'express';

/**
 * Share links, tag pages, a homeowner's pages, invitation and unsubscribe links are meant for whoever holds them,
 * and the API is for the app: crawlers stay off all of them. Format: RFC 9309 (Robots Exclusion Protocol).
 */
export const ROBOTS_TXT = [
  'User-agent: *',
  'Disallow: /s/',
  'Disallow: /t/',
  'Disallow: /my/',
  'Disallow: /unsubscribe/',
  'Disallow: /booking-reply/',
  'Disallow: /welcome/',
  'Disallow: /api/',
  '',
].join('\n');

export const robotsTxt: RequestHandler = (_req, res) => {
  res.type('text/plain').setHeader('Cache-Control', 'public, max-age=86400');
  res.send(ROBOTS_TXT);
};

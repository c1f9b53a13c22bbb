import pino from 'pino';

/**
 * Capability tokens (share links valid for years, unsubscribe links, sign-in links) and invitation ids open something
 * to whoever holds them, so request logs show their place, never their value. Tag codes (`/t/`) are printed on the
 * appliance itself and stay.
 */
const CAPABILITY_PATHS: [RegExp, string][] = [
  [/^\/s\/[^/]+/i, '/s/[token]'],
  [/^\/api\/share\/[^/]+/i, '/api/share/[token]'],
  [/^\/unsubscribe\/[^/]+/i, '/unsubscribe/[token]'],
  [/^\/api\/unsubscribe\/[^/]+/i, '/api/unsubscribe/[token]'],
  [/^\/booking-reply\/[^/]+/i, '/booking-reply/[token]'],
  [/^\/api\/booking-reply\/[^/]+/i, '/api/booking-reply/[token]'],
  [/^\/welcome\/[^/]+/i, '/welcome/[invitation]'],
  [/^\/api\/invitations\/[^/]+/i, '/api/invitations/[invitation]'],
  [/^\/api\/auth\/reset-password\/[^/]+/i, '/api/auth/reset-password/[token]'],
];
/** Query parameters that carry a token, and those that carry another address (which may hold one). */
const TOKEN_PARAMS = new Set(['token']);
const URL_PARAMS = new Set(['callbackurl', 'errorcallbackurl', 'newusercallbackurl']);

const decode = (s: string) => {
  try {
    return decodeURIComponent(s.replace(/\+/g, ' '));
  } catch {
    return s;
  }
};

function redactQuery(query: string): string {
  return query
    .split('&')
    .map((part) => {
      const eq = part.indexOf('=');
      if (eq < 0) return part;
      const key = decode(part.slice(0, eq)).toLowerCase();
      if (TOKEN_PARAMS.has(key)) return `${part.slice(0, eq)}=[token]`;
      if (URL_PARAMS.has(key)) return `${part.slice(0, eq)}=${encodeURIComponent(redactUrl(decode(part.slice(eq + 1))))}`;
      return part;
    })
    .join('&');
}

/** A URL (path, or absolute as in Referer and Location) with capability tokens replaced by their kind. */
export function redactUrl(url: string): string {
  const origin = /^[a-z][a-z0-9+.-]*:\/\/[^/?#]*/i.exec(url)?.[0] ?? '';
  const rest = url.slice(origin.length);
  const cut = rest.search(/[?#]/);
  let path = cut < 0 ? rest : rest.slice(0, cut);
  const tail = cut < 0 ? '' : rest.slice(cut);
  for (const [pattern, replacement] of CAPABILITY_PATHS) path = path.replace(pattern, replacement);
  const hash = tail.indexOf('#');
  const query = (hash < 0 ? tail : tail.slice(0, hash)).replace(/^\?/, '');
  return `${origin}${path}${query ? `?${redactQuery(query)}` : ''}`;
}

/** Fields an error may carry that repeat the values a query was run with (a row's names, e-mails, notes). */
const VALUE_FIELDS = ['params', 'parameters', 'detail', 'where', 'internalQuery'];

/** Drizzle's failed-query error puts the parameters in its message: "Failed query: <sql>\nparams: <values>". */
const withoutParams = (text: string) => text.replace(/(Failed query: [\s\S]*?)\nparams: [\s\S]*?(?=\n {4}at |\ncaused by: |$)/, '$1');

/** PostgreSQL's error fields that name what failed (never the values). */
const PG_FIELDS = ['code', 'severity', 'constraint', 'table', 'column', 'schema', 'dataType', 'routine'] as const;
const isPgError = (err: unknown): err is Record<string, unknown> =>
  err instanceof Error && typeof (err as { severity?: unknown }).severity === 'string' && typeof (err as { code?: unknown }).code === 'string';

/**
 * An error as the logs show it: the query text is kept (it names tables and placeholders), the values it ran with
 * are not. PostgreSQL's own messages quote the offending value ('invalid input syntax for type uuid: "…"'), so
 * quoted text in them is blanked; the constraint, table and column stay in their own fields.
 */
function scrub(err: unknown, depth = 0): unknown {
  if (!(err instanceof Error) || depth > 5) return err;
  const isPg = isPgError(err);
  const clean = (text: string) => {
    const stripped = withoutParams(text);
    return isPg ? stripped.replace(/"[^"\n]*"/g, '"…"') : stripped;
  };
  const copy = Object.create(Object.getPrototypeOf(err)) as Error & Record<string, unknown>;
  for (const key of Object.keys(err)) if (!VALUE_FIELDS.includes(key)) copy[key] = (err as unknown as Record<string, unknown>)[key];
  Object.defineProperty(copy, 'message', { value: clean(err.message), enumerable: false, writable: true });
  Object.defineProperty(copy, 'stack', { value: err.stack && clean(err.stack), enumerable: false, writable: true });
  if (err.cause !== undefined) Object.defineProperty(copy, 'cause', { value: scrub(err.cause, depth + 1), enumerable: false, writable: true });
  // A failed query's database error is only its cause, whose fields the log would otherwise drop.
  if (!isPg && isPgError(err.cause)) copy.db = Object.fromEntries(PG_FIELDS.map((k) => [k, (err.cause as Record<string, unknown>)[k]]).filter(([, v]) => v !== undefined));
  return copy;
}

export const errSerializer = (err: unknown) => pino.stdSerializers.err(scrub(err) as Error);

type SerializedReq = { url?: string; query?: unknown; params?: unknown; headers?: Record<string, unknown> };
type SerializedRes = { headers?: Record<string, unknown> };

/** pino-http's request: the redacted URL and Referer, and no separate query or route params (the URL has them). */
export function reqSerializer(req: SerializedReq) {
  const { query: _query, params: _params, ...rest } = req;
  const referer = req.headers?.referer;
  return {
    ...rest,
    url: typeof req.url === 'string' ? redactUrl(req.url) : req.url,
    headers: req.headers && { ...req.headers, ...(typeof referer === 'string' ? { referer: redactUrl(referer) } : {}) },
  };
}

/** A redirect's Location (the welcome page after a sign-in link) is redacted too. */
export function resSerializer(res: SerializedRes) {
  const location = res.headers?.location;
  return typeof location === 'string' ? { ...res, headers: { ...res.headers, location: redactUrl(location) } } : res;
}

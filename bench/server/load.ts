import autocannon, { type Result } from 'autocannon';

export type LoadResult = { p50: number; p975: number; p99: number; ratePerSec: number; total: number; failed: number; seconds: number };

/**
 * One autocannon run. `paths` gives a fresh path per request (random parameters). `amount` bounds the count and
 * `maxSeconds` the time: whichever comes first ends the run.
 */
/**
 * The session cookie as a browser holds it just now: better-auth's session cache cookie lasts a minute and a
 * browser gets it renewed on its next request, so each run starts from a renewed one, as a browser in use would.
 */
async function freshCookie(baseUrl: string, cookie: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/me`, { headers: { cookie } });
  const jar = new Map(cookie.split('; ').map((c) => [c.slice(0, c.indexOf('=')), c] as const));
  for (const set of res.headers.getSetCookie()) {
    const pair = set.split(';')[0];
    jar.set(pair.slice(0, pair.indexOf('=')), pair);
  }
  return [...jar.values()].join('; ');
}

export async function runLoad(opts: {
  baseUrl: string;
  cookie: string;
  paths: () => string;
  connections: number;
  overallRate?: number;
  amount?: number;
  maxSeconds: number;
}): Promise<LoadResult> {
  const cookie = await freshCookie(opts.baseUrl, opts.cookie);
  return new Promise((resolve, reject) => {
    let timer: NodeJS.Timeout | undefined;
    const instance = autocannon(
      {
        url: opts.baseUrl,
        connections: opts.connections,
        ...(opts.overallRate ? { overallRate: opts.overallRate } : {}),
        ...(opts.amount ? { amount: opts.amount } : { duration: opts.maxSeconds }),
        timeout: 10,
        headers: { cookie, accept: 'application/json', 'accept-encoding': 'gzip, deflate, br' },
        requests: [{ method: 'GET', setupRequest: (req) => ({ ...req, path: opts.paths() }) }],
      },
      (err, result: Result) => {
        clearTimeout(timer);
        if (err) return reject(err);
        const total = result.requests.total;
        resolve({
          p50: result.latency.p50,
          p975: result.latency.p97_5,
          p99: result.latency.p99,
          ratePerSec: result.duration > 0 ? total / result.duration : 0,
          total,
          failed: result.errors + result.timeouts + result.non2xx,
          seconds: result.duration,
        });
      },
    );
    if (opts.amount) timer = setTimeout(() => instance.stop(), opts.maxSeconds * 1000);
  });
}

export const pick = <T>(list: readonly T[]): T => list[Math.floor(Math.random() * list.length)];

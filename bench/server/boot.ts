import crypto from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { parseConfig } from '../../server/config';
import { buildContext, closeContext } from '../../server/build-context';
import { createApp } from '../../server/app';
import { createLogger } from '../../server/logger';

/** The real app (createApp + buildContext) on a random loopback port, logging nothing. */
export async function bootApp(opts: { databaseUrl: string; s3Endpoint: string; s3Bucket: string; clientDir?: string }) {
  const server = http.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  const baseUrl = `http://127.0.0.1:${port}`;
  const config = parseConfig({
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    PORT: String(port),
    BASE_URL: baseUrl,
    DATABASE_URL: opts.databaseUrl,
    BETTER_AUTH_SECRET: crypto.randomBytes(32).toString('hex'),
    LOG_LEVEL: 'silent',
    SIGN_IN_RATE_LIMIT: '100000',
    S3_ENDPOINT: opts.s3Endpoint,
    S3_BUCKET: opts.s3Bucket,
  });
  const ctx = buildContext(config, { logger: createLogger('silent') });
  server.on('request', createApp(ctx, { clientDir: opts.clientDir }));
  return {
    ctx,
    baseUrl,
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await closeContext(ctx);
    },
  };
}

/** Signs in through better-auth's endpoint, as the browser does, and returns the session cookie. */
export async function signIn(baseUrl: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: baseUrl },
    body: JSON.stringify({ email, password }),
  });
  if (!res.ok) throw new Error(`Sign-in as ${email} failed: ${res.status} ${await res.text()}`);
  const cookies = res.headers.getSetCookie().map((c) => c.split(';')[0]);
  if (!cookies.length) throw new Error('Sign-in set no cookie');
  return cookies.join('; ');
}

export async function getJson<T>(baseUrl: string, path: string, cookie: string): Promise<T> {
  const res = await fetch(`${baseUrl}${path}`, { headers: { cookie, accept: 'application/json' } });
  if (!res.ok) throw new Error(`GET ${path} answered ${res.status}: ${await res.text()}`);
  return (await res.json()) as T;
}

import { betterAuth } from 'better-auth';
import { createAuthMiddleware } from 'better-auth/api';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import type { NodePgDatabase } from 'drizzle-orm/node-postgres';
import * as schema from '../db/schema/index';
import type { AppConfig } from '../config';
import { magicLinkAuth, type MagicLinkDeps } from './magic-link';
import { passwordGuards } from './password-guards';
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from './password-policy';
import { passwordChangeEndsOtherSessions } from './password-change';
import { storableTextPlugin } from './storable-text-plugin';

export const CLIENT_IP_HEADER = 'x-lifeplate-client-ip';

export function createAuth(db: NodePgDatabase<typeof schema>, config: AppConfig, deps: MagicLinkDeps) {
  const links = magicLinkAuth(db, deps);
  const passwords = passwordGuards(db, config.BETTER_AUTH_SECRET);
  return betterAuth({
    appName: 'Lifeplate',
    baseURL: config.BASE_URL,
    basePath: '/api/auth',
    secret: config.BETTER_AUTH_SECRET,
    trustedOrigins: [config.BASE_URL],
    database: drizzleAdapter(db, { provider: 'pg', usePlural: true, schema }),
    // Accounts come only from invitations and homeowner links (server-side), so open sign-up is off: it answers the
    // same 400 for every address instead of telling which ones exist.
    emailAndPassword: { enabled: true, disableSignUp: true, minPasswordLength: PASSWORD_MIN_LENGTH, maxPasswordLength: PASSWORD_MAX_LENGTH, autoSignIn: true },
    plugins: [storableTextPlugin, links.plugin, passwordChangeEndsOtherSessions()],
    hooks: {
      before: createAuthMiddleware(async (ctx) => (await passwords.before(ctx)) ?? links.beforeHook(ctx)),
      after: createAuthMiddleware(async (ctx) => passwords.after(ctx)),
    },
    databaseHooks: links.databaseHooks,
    session: {
      expiresIn: 60 * 60 * 24 * 14,
      updateAge: 60 * 60 * 24,
      // The session is read from a signed cookie for up to a minute instead of two queries per request. Our API still
      // refuses a session the moment it is signed out, deleted elsewhere or its member deactivated: the session row
      // is checked in the query that reads the membership on every request (server/auth/principal-repository.ts).
      // better-auth's own endpoints outside its sensitive ones (/get-session, /update-user) still trust the cookie
      // for that minute; the app calls neither from the browser. A password change deletes the user's other sessions
      // (./password-change.ts), so they are refused at once too.
      cookieCache: { enabled: true, maxAge: 60 },
    },
    rateLimit: {
      enabled: true,
      storage: 'database',
      window: 60,
      max: 300,
      customRules: {
        '/sign-in/email': { window: 60, max: config.SIGN_IN_RATE_LIMIT },
        '/sign-up/email': { window: 60, max: config.SIGN_IN_RATE_LIMIT },
        [links.paths.signIn]: { window: 60, max: config.SIGN_IN_RATE_LIMIT },
        [links.paths.verify]: { window: 60, max: config.SIGN_IN_RATE_LIMIT },
      },
    },
    advanced: {
      useSecureCookies: config.BASE_URL.startsWith('https://'),
      database: { generateId: 'uuid' },
      // Set by our own middleware from Express's req.ip (which honours TRUST_PROXY); any client-sent value is replaced.
      ipAddress: { ipAddressHeaders: [CLIENT_IP_HEADER] },
    },
    // Errors other than better-auth's own answers (a database outage) go on to Express's error handler, which
    // answers 503 for an outage; without this the router answered a bare 500 and wrote to console.error.
    onAPIError: { throw: true },
    telemetry: { enabled: false },
    logger: {
      disabled: config.LOG_LEVEL === 'silent',
      // Into the app's own log, where an error loses the values its query ran with (server/log-redaction.ts).
      log: (level, message, ...args) => deps.logger[level]({ err: args.find((a) => a instanceof Error) }, message),
    },
  });
}

export type Auth = ReturnType<typeof createAuth>;

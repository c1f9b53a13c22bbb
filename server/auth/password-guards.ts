import { APIError, isAPIError } from 'better-auth/api';
import type { Db } from '../db/client';
import { passwordProblem } from './password-policy';
import { createSignInThrottle } from './sign-in-throttle';

/** The part of better-auth's hook context these guards read. */
export type GuardContext = { path?: string; body?: unknown; context: { returned?: unknown } };

const SIGN_IN_PATH = '/sign-in/email';
/** Endpoints that set a password, and the body field holding the new one. Open sign-up is off (server/auth/auth.ts). */
const NEW_PASSWORD_FIELD: Record<string, string> = { '/change-password': 'newPassword', '/reset-password': 'newPassword', '/set-password': 'newPassword' };

const field = (body: unknown, name: string) => {
  const value = (body as Record<string, unknown> | null | undefined)?.[name];
  return typeof value === 'string' ? value : null;
};

function tooManyAttempts(retryAfterSeconds: number) {
  const minutes = Math.max(1, Math.ceil(retryAfterSeconds / 60));
  const message = `Too many sign-in attempts for this address. Try again in ${minutes === 1 ? 'a minute' : `${minutes} minutes`}, or e-mail yourself a sign-in link.`;
  return new APIError('TOO_MANY_REQUESTS', { code: 'too_many_attempts', message }, { 'Retry-After': String(retryAfterSeconds) });
}

/**
 * Password sign-in is limited per typed address (counted in the database, whatever the client address), and a new
 * password must pass the policy; both answer the same for every address, so neither tells which ones exist.
 */
export function passwordGuards(db: Db, secret: string) {
  const throttle = createSignInThrottle(db, secret);
  return {
    async before(ctx: GuardContext) {
      if (ctx.path === SIGN_IN_PATH) {
        const email = field(ctx.body, 'email');
        if (!email) return; // the endpoint itself answers 400
        const decision = await throttle.attempt(email);
        if (!decision.allowed) throw tooManyAttempts(decision.retryAfterSeconds);
        return;
      }
      const name = ctx.path ? NEW_PASSWORD_FIELD[ctx.path] : undefined;
      const password = name ? field(ctx.body, name) : null;
      if (!name || password === null) return;
      const problem = await passwordProblem(password);
      if (problem) throw new APIError('BAD_REQUEST', { code: 'validation_failed', message: problem, details: { [name]: [problem] } });
    },
    async after(ctx: GuardContext) {
      if (ctx.path !== SIGN_IN_PATH) return;
      const email = field(ctx.body, 'email');
      if (!email) return;
      const returned = ctx.context.returned;
      if (!isAPIError(returned)) await throttle.succeeded(email);
      // A wrong password (401) and a lock (429) keep their count; any other failure never judged the password.
      else if (returned.statusCode !== 401 && returned.statusCode !== 429) await throttle.refund(email).catch(() => {});
    },
  };
}

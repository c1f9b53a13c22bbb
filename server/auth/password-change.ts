import type { BetterAuthPlugin } from 'better-auth';
import { createAuthMiddleware } from 'better-auth/api';

export const CHANGE_PASSWORD_PATH = '/change-password';

/**
 * A changed password ends every other session of the user, whatever the client asked for: a password is changed
 * because it may be known to someone else, and their devices must be signed out with it.
 */
export function passwordChangeEndsOtherSessions(): BetterAuthPlugin {
  return {
    id: 'lifeplate-password-change-ends-sessions',
    hooks: {
      before: [
        {
          matcher: (ctx) => ctx.path === CHANGE_PASSWORD_PATH,
          handler: createAuthMiddleware(async (ctx) => {
            const body = typeof ctx.body === 'object' && ctx.body ? (ctx.body as Record<string, unknown>) : {};
            return { context: { body: { ...body, revokeOtherSessions: true } } };
          }),
        },
      ],
    },
  };
}

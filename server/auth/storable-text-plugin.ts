import type { BetterAuthPlugin } from 'better-auth';
import { APIError, createAuthMiddleware } from 'better-auth/api';
import { UNSTORABLE_TEXT_MESSAGE } from '../../shared/schemas/common';
import { unstorableTextPaths } from '../lib/storable-text';

/**
 * better-auth writes names, e-mail addresses and images straight to PostgreSQL; text it cannot store (U+0000, a lone
 * surrogate) made update-user answer 500 and sign-up fail opaquely. Every one of its endpoints is guarded here, the
 * same rule as the app's own schemas, answered in better-auth's own error shape.
 */
export const storableTextPlugin = {
  id: 'lifeplate-storable-text',
  hooks: {
    before: [
      {
        matcher: () => true,
        handler: createAuthMiddleware(async (ctx) => {
          const fields = [...unstorableTextPaths(ctx.body ?? {}), ...unstorableTextPaths(ctx.query ?? {})];
          if (fields.length) throw new APIError('BAD_REQUEST', { code: 'UNSTORABLE_TEXT', message: UNSTORABLE_TEXT_MESSAGE, fields });
        }),
      },
    ],
  },
} satisfies BetterAuthPlugin;

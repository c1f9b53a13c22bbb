// Used only by the better-auth schema generator (see DEVELOPERS.md); never imported by the app.
import { drizzle } from 'drizzle-orm/node-postgres';
import { createAuth } from './auth';
import { parseConfig } from '../config';

const config = parseConfig({
  DATABASE_URL: 'postgres://generator@127.0.0.1:1/generator',
  BETTER_AUTH_SECRET: 'schema-generator-only-secret-0000000000',
});
const noMail = { send: async () => 'sent' as const };
export const auth = createAuth(drizzle(config.DATABASE_URL), config, { mail: noMail, logger: console });

import type { AppConfig } from './config';
import type { AppContext } from './context';
import { createAuth } from './auth/auth';
import { createDb } from './db/client';
import { createLogger } from './logger';
import { createObjectStorage } from './lib/object-storage';
import { createMailer } from './lib/mailer';
import { createMailQueue } from './modules/mail';

export function buildContext(config: AppConfig, overrides: Partial<AppContext> = {}): AppContext {
  const logger = overrides.logger ?? createLogger(config.LOG_LEVEL, config.LOG_FORMAT);
  const { db, pool } = createDb(config.DATABASE_URL, { onConnectionError: (err) => logger.warn({ err }, 'database connection lost') });
  const storage = overrides.storage ?? createObjectStorage(config);
  const mailer = overrides.mailer ?? createMailer(config);
  const mail = overrides.mail ?? createMailQueue({ db, mailer, logger, secret: config.BETTER_AUTH_SECRET });
  return { config, db, pool, auth: createAuth(db, config, { mail, logger }), logger, storage, mailer, mail, ...overrides };
}

export async function closeContext(ctx: AppContext) {
  ctx.storage.destroy();
  ctx.mailer.close();
  await ctx.pool.end();
}

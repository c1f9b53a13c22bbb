import type { AppConfig } from './config';
import type { AppContext } from './context';
import { createAuth } from './auth/auth';
import { createDb } from './db/client';
import { createLogger } from './logger';

export function buildContext(config: AppConfig, overrides: Partial<AppContext> = {}): AppContext {
  const { db, pool } = createDb(config.DATABASE_URL);
  const logger = overrides.logger ?? createLogger(config.LOG_LEVEL);
  return { config, db, pool, auth: createAuth(db, config), logger, ...overrides };
}

export async function closeContext(ctx: AppContext) {
  await ctx.pool.end();
}

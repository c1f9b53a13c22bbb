import type { AppConfig } from './config';
import type { AppContext } from './context';
import { createAuth } from './auth/auth';
import { createDb } from './db/client';
import { createLogger } from './logger';
import { createObjectStorage } from './lib/object-storage';

export function buildContext(config: AppConfig, overrides: Partial<AppContext> = {}): AppContext {
  const { db, pool } = createDb(config.DATABASE_URL);
  const logger = overrides.logger ?? createLogger(config.LOG_LEVEL);
  const storage = overrides.storage ?? createObjectStorage(config);
  return { config, db, pool, auth: createAuth(db, config), logger, storage, ...overrides };
}

export async function closeContext(ctx: AppContext) {
  ctx.storage.destroy();
  await ctx.pool.end();
}

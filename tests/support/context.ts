import { inject } from 'vitest';
import { parseConfig, type AppConfig } from '../../server/config';
import { buildContext } from '../../server/build-context';
import { createApp } from '../../server/app';
import type { AppContext } from '../../server/context';
import { createLogger } from '../../server/logger';

export function testConfig(overrides: Record<string, string> = {}): AppConfig {
  return parseConfig({
    NODE_ENV: 'test',
    DATABASE_URL: inject('databaseUrl'),
    BETTER_AUTH_SECRET: 'test-secret-test-secret-test-secret-0123',
    BASE_URL: 'http://127.0.0.1:3999',
    LOG_LEVEL: 'silent',
    SIGN_IN_RATE_LIMIT: '100000',
    S3_ENDPOINT: inject('s3Endpoint'),
    S3_BUCKET: inject('s3Bucket'),
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(inject('smtpPort')),
    FAKE_SMTP_OUTBOX: inject('outboxDir'),
    ...overrides,
  });
}

export function testContext(overrides: Record<string, string> = {}): AppContext {
  const config = testConfig(overrides);
  return buildContext(config, { logger: createLogger('silent') });
}

export function testApp(overrides: Record<string, string> = {}) {
  const ctx = testContext(overrides);
  return { ctx, app: createApp(ctx) };
}

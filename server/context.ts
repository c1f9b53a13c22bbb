import type pg from 'pg';
import type { Logger } from 'pino';
import type { Auth } from './auth/auth';
import type { AppConfig } from './config';
import type { Db } from './db/client';
import type { ObjectStorage } from './lib/object-storage';
import type { Mailer } from './lib/mailer';
import type { MailQueue } from './modules/mail';

/** Everything a request handler may need, built once at boot and passed down explicitly (no module singletons). */
export type AppContext = {
  config: AppConfig;
  db: Db;
  pool: pg.Pool;
  auth: Auth;
  logger: Logger;
  /** Photo bytes (S3 API; the local fake in development and tests). */
  storage: ObjectStorage;
  /** Outgoing mail over SMTP (the local fake in development and tests). */
  mailer: Mailer;
  /** Every e-mail goes through this durable queue (server/modules/mail/), never straight to `mailer`. */
  mail: MailQueue;
};

import { z } from 'zod';

const optionalString = z.string().trim().min(1).optional();

export const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    HOST: z.string().default('127.0.0.1'),
    PORT: z.coerce.number().int().min(1).max(65535).default(3000),
    BASE_URL: z.url().optional(),
    DATABASE_URL: z.url({ protocol: /^postgres(ql)?$/ }),
    BETTER_AUTH_SECRET: z.string().min(32, 'must be at least 32 characters'),
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
    /** Defaults to json in production (a log collector reads it), else pretty; npm start and npm run dev pick pretty. */
    LOG_FORMAT: z.enum(['json', 'pretty']).optional(),
    TLS_CERT: optionalString,
    TLS_KEY: optionalString,
    S3_ENDPOINT: z.url().optional(),
    S3_REGION: z.string().default('us-east-1'),
    S3_BUCKET: z.string().default('lifeplate'),
    S3_ACCESS_KEY_ID: z.string().default('S3RVER'),
    S3_SECRET_ACCESS_KEY: z.string().default('S3RVER'),
    SMTP_HOST: z.string().default('127.0.0.1'),
    SMTP_PORT: z.coerce.number().int().default(2525),
    SMTP_USER: optionalString,
    SMTP_PASS: optionalString,
    SMTP_SECURE: z.stringbool().default(false),
    MAIL_FROM: z.string().default('Lifeplate <no-reply@lifeplate.test>'),
    /** The local SMTP fake's folder, shown on the development outbox page; never set in production. */
    FAKE_SMTP_OUTBOX: optionalString,
    /**
     * The proxy in front of the app whose X-Forwarded-For is believed (Express `trust proxy`): its address or subnet,
     * `loopback` for one on the same machine, or a number of hops. Unset, no forwarded address is believed.
     */
    TRUST_PROXY: z
      .string()
      .trim()
      .default('false')
      .refine((v) => v !== 'true', 'name the proxy (its address, subnet or `loopback`) or the number of proxies: `true` would believe any client\'s X-Forwarded-For'),
    SIGN_IN_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
  })
  .superRefine((env, ctx) => {
    if (Boolean(env.TLS_CERT) !== Boolean(env.TLS_KEY)) {
      ctx.addIssue({ code: 'custom', path: ['TLS_KEY'], message: 'TLS_CERT and TLS_KEY must be given together' });
    }
  })
  .transform((env) => {
    const scheme = env.TLS_CERT ? 'https' : 'http';
    return {
      ...env,
      BASE_URL: (env.BASE_URL ?? `${scheme}://${env.HOST}:${env.PORT}`).replace(/\/$/, ''),
      LOG_FORMAT: env.LOG_FORMAT ?? (env.NODE_ENV === 'production' ? 'json' : 'pretty'),
    };
  });

export type AppConfig = z.infer<typeof envSchema>;

export class ConfigError extends Error {}

export function parseConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const result = envSchema.safeParse(env);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.') || '(env)'}: ${i.message}`);
    throw new ConfigError(`Invalid configuration:\n${lines.join('\n')}`);
  }
  return result.data;
}

import { z } from 'zod';

/** The environment, read and validated once at start. A bad value stops the
 * server with a message naming the variable instead of failing later. */
const environment = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4600),
  HOST: z.string().default('127.0.0.1'),
  /** Server processes sharing the port (1 = no workers). */
  WEB_CONCURRENCY: z.coerce.number().int().min(1).max(32).default(1),
  /** Express `trust proxy`: which hops may set X-Forwarded-For. None by default, so a caller cannot pick
   * its own address (and fresh sign-in attempts); set it where a load balancer sits in front (docker/). */
  TRUST_PROXY: z
    .string()
    .default('false')
    .transform((v) => (v === 'false' ? false : v === 'true' ? true : /^\d+$/.test(v) ? Number(v) : v)),
  DATABASE_URL: z.string().url(),
  JWT_SECRET: z.string().min(32, 'must be at least 32 characters'),
  PUBLIC_URL: z.string().url().optional(),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(4625),
  MAIL_FROM: z.string().default('Nestkeeper <no-reply@nestkeeper.test>'),
  /** The provider's secret key: a test key (`sk_test_…`) keeps the clerk's test-card shortcut; a live key (`sk_live_…`) leaves the renter's hosted page as the only way. */
  PAYMENT_API_KEY: z
    .string()
    .regex(/^[sr]k_(test|live)_\w+$/, 'must be a secret key of the payment provider (sk_test_… or sk_live_…)')
    .default('sk_test_nestkeeper_local'),
  /** The matching publishable key (`pk_test_…` / `pk_live_…`), safe to show in the browser. */
  PAYMENT_PUBLISHABLE_KEY: z
    .string()
    .regex(/^pk_(test|live)_\w+$/, 'must be a publishable key of the payment provider (pk_test_… or pk_live_…)')
    .default('pk_test_nestkeeper_local'),
  PAYMENT_API_HOST: z.string().default('127.0.0.1'),
  PAYMENT_API_PORT: z.coerce.number().int().min(0).max(65535).default(4610),
  PAYMENT_API_PROTOCOL: z.enum(['http', 'https']).default('http'),
  /** Signs the provider's webhook deliveries; made per installation (`npm start` keeps one beside the data), never built in. */
  PAYMENT_WEBHOOK_SECRET: z
    .string({ message: "is required: the signing secret of the payment provider's webhook endpoint" })
    .min(24, 'must be at least 24 characters'),
  /** How long one call to the provider may take before the SDK retries it (same idempotency key). */
  PAYMENT_TIMEOUT_MS: z.coerce.number().int().min(100).max(120_000).default(15_000),
  START_LOCAL_FAKES: z
    .enum(['true', 'false'])
    .default('true')
    .transform((v) => v === 'true'),
  RUN_SCHEDULER: z
    .enum(['true', 'false'])
    .default('true')
    .transform((v) => v === 'true'),
  CLIENT_DIR: z.string().default('dist/client'),
  BCRYPT_COST: z.coerce.number().int().min(12).max(15).default(12),
  LOGIN_ATTEMPTS_PER_10_MIN: z.coerce.number().int().min(1).default(10),
  /** "Forgot password" requests per hour for one e-mail, and from one address. */
  RESET_REQUESTS_PER_HOUR_PER_EMAIL: z.coerce.number().int().min(1).default(3),
  RESET_REQUESTS_PER_HOUR_PER_ADDRESS: z.coerce.number().int().min(1).default(20),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /** JSON lines for log tools; `pretty` (pino-pretty) is what `npm start` shows a person. */
  LOG_FORMAT: z.enum(['json', 'pretty']).default('json'),
  /** Bearer token for `GET /metrics` from another machine (made per installation by `npm start`); without it only this machine may read them. */
  METRICS_TOKEN: z.preprocess((v) => (v === '' ? undefined : v), z.string().min(24, 'must be at least 24 characters').optional()),
  /** PostgreSQL's client programs (pg_dump, pg_restore) for backups. */
  PG_BIN: z.string().default('/usr/lib/postgresql/15/bin'),
  BACKUP_DIR: z.string().default('.data/backups'),
  /** The nightly backup routine; `false` where backups are taken another way (WAL archiving, the host's tools). */
  NIGHTLY_BACKUP: z
    .enum(['true', 'false'])
    .default('true')
    .transform((v) => v === 'true'),
  BACKUP_KEEP_DAILY: z.coerce.number().int().min(1).max(366).default(14),
  BACKUP_KEEP_WEEKLY: z.coerce.number().int().min(0).max(260).default(8),
});

export type Config = z.infer<typeof environment>;

/** Test or live, from the secret key's own prefix (the provider's convention). */
export const paymentMode = (config: Pick<Config, 'PAYMENT_API_KEY'>): 'test' | 'live' => (/^[sr]k_live_/.test(config.PAYMENT_API_KEY) ? 'live' : 'test');

export function readConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = environment
    .refine((c) => paymentMode(c) === (c.PAYMENT_PUBLISHABLE_KEY.startsWith('pk_live_') ? 'live' : 'test'), {
      message: 'the secret and publishable keys must both be test keys or both live keys',
      path: ['PAYMENT_PUBLISHABLE_KEY'],
    })
    .safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Nestkeeper cannot start; fix these settings:\n${lines.join('\n')}`);
  }
  return parsed.data;
}

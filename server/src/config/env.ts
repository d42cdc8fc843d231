// The only place the server reads its environment: parsed once, failing fast with one clear line.
import { z } from 'zod';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4600),
  HOST: z.string().default('127.0.0.1'),
  DATABASE_URL: z.string().regex(/^(mariadb|mysql):\/\//, 'DATABASE_URL must start with mariadb:// or mysql://'),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters'),
  APP_BASE_URL: z.url().default('http://127.0.0.1:4600'),
  SESSION_IDLE_MINUTES: z.coerce.number().int().positive().default(30),
  SESSION_ABSOLUTE_HOURS: z.coerce.number().int().positive().default(12),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().positive().default(4625),
  SMTP_SECURE: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  MAIL_FROM: z.string().default('Bumpboard <no-reply@bumpboard.test>'),
  /** The operating carrier named in written statements; the demo installation falls back to its invented carrier. */
  CARRIER_NAME: z.string().trim().min(1, 'CARRIER_NAME must not be empty').max(80, 'CARRIER_NAME must be at most 80 characters').optional(),
  STRIPE_SECRET_KEY: z.string().default('sk_test_local'),
  /** Empty means the real Stripe API; otherwise e.g. http://127.0.0.1:4602 for the local stand-in. */
  STRIPE_API_URL: z.string().default(''),
  STRIPE_WEBHOOK_SECRET: z.string().default('whsec_local_development_secret'),
  STATIC_DIR: z.string().default('dist/client'),
  LOG_REQUESTS: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
});

export type Env = z.infer<typeof envSchema>;

export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    throw new Error(`Configuration error: ${first.path.join('.')}: ${first.message}`);
  }
  return parsed.data;
}

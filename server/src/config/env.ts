// The only place the server reads its environment: parsed once, failing fast with one clear line.
import { isIP } from 'node:net';
import { z } from 'zod';

/** Well-known values that must never protect a production deployment: the built-in defaults and the test harness's. */
const DEV_DEFAULTS = { STRIPE_SECRET_KEY: 'sk_test_local', STRIPE_WEBHOOK_SECRET: 'whsec_local_development_secret' } as const;
const KNOWN_NON_SECRETS = new Set(['test-secret-test-secret-test-secret-42', 'sk_test_local', 'sk_test_local_stand_in', 'whsec_local_development_secret']);
const PROXY_NAMES = new Set(['loopback', 'linklocal', 'uniquelocal']);

/**
 * Which proxies may tell us the client's address (X-Forwarded-For). Default none: the address is the socket's peer.
 * A hop count ("1"), or a comma list of addresses, CIDR ranges and Express's names loopback, linklocal, uniquelocal.
 */
const trustProxySchema = z
  .string()
  .default('')
  .transform((v) => v.trim())
  .refine((v) => v === '' || /^\d+$/.test(v) || v.split(',').every((p) => PROXY_NAMES.has(p.trim()) || isIP(p.trim().split('/')[0]) !== 0), {
    message: 'TRUST_PROXY must be empty, a hop count, or a comma list of addresses, CIDR ranges, loopback, linklocal, uniquelocal',
  })
  .transform((v): false | number | string[] => (v === '' ? false : /^\d+$/.test(v) ? Number(v) : v.split(',').map((p) => p.trim())));

const envSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    PORT: z.coerce.number().int().min(0).max(65535).default(4600),
    HOST: z.string().default('127.0.0.1'),
    DATABASE_URL: z.string().regex(/^(mariadb|mysql):\/\//, 'DATABASE_URL must start with mariadb:// or mysql://'),
    /**
     * MariaDB on the same machine: its Unix socket, used instead of the URL's host and port (user, password and
     * database still come from the URL). A statement then costs the kernel far less than through loopback TCP.
     */
    DATABASE_SOCKET: z.string().startsWith('/', 'DATABASE_SOCKET must be an absolute path to the MariaDB socket').optional(),
    SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters'),
    APP_BASE_URL: z.url().default('http://127.0.0.1:4600'),
    SESSION_IDLE_MINUTES: z.coerce.number().int().positive().default(30),
    SESSION_ABSOLUTE_HOURS: z.coerce.number().int().positive().default(12),
    /** Set to run several app processes: socket.io's notices and the server-to-server messages go through Redis. */
    REDIS_URL: z.string().regex(/^redis:\/\/[^\s]+$/, 'REDIS_URL must look like redis://127.0.0.1:6379').optional(),
    TRUST_PROXY: trustProxySchema,
    SMTP_HOST: z.string().default('127.0.0.1'),
    SMTP_PORT: z.coerce.number().int().positive().default(4625),
    SMTP_SECURE: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
    MAIL_FROM: z.string().default('Bumpboard <no-reply@bumpboard.test>'),
    /** The operating carrier named in written statements; the demo installation falls back to its invented carrier. */
    CARRIER_NAME: z.string().trim().min(1, 'CARRIER_NAME must not be empty').max(80, 'CARRIER_NAME must be at most 80 characters').optional(),
    STRIPE_SECRET_KEY: z.string().min(1).optional(),
    /** Empty means the real Stripe API; otherwise e.g. http://127.0.0.1:4602 for the local stand-in. */
    STRIPE_API_URL: z.string().default(''),
    STRIPE_WEBHOOK_SECRET: z.string().min(1).optional(),
    STATIC_DIR: z.string().default('dist/client'),
    /**
     * How long a claimed notice is reserved for the worker that claimed it. After a crash its claims wait this long
     * before another worker (or the restarted one) sends them; too short and a slow send is sent twice.
     */
    OUTBOX_LEASE_SECONDS: z.coerce.number().int().min(5, 'OUTBOX_LEASE_SECONDS must be at least 5').max(3600, 'OUTBOX_LEASE_SECONDS must be at most 3600').default(120),
    /**
     * How long a compensation (or bank transfer) being paid is reserved for the process that claimed it. After a
     * crash its claims wait this long before another process (or the restarted one) takes them up; the provider's
     * keys make even a too-short lease pay once, but a lease longer than a provider call with its retries saves the
     * second call.
     */
    PAYMENTS_LEASE_SECONDS: z.coerce.number().int().min(5, 'PAYMENTS_LEASE_SECONDS must be at least 5').max(3600, 'PAYMENTS_LEASE_SECONDS must be at most 3600').default(120),
    /**
     * How long a flight being recomputed is reserved for the process that claimed it. After a crash, its flights are
     * recomputed by another process this long after; a recompute takes well under a second.
     */
    RECOMPUTE_LEASE_SECONDS: z.coerce.number().int().min(2, 'RECOMPUTE_LEASE_SECONDS must be at least 2').max(3600, 'RECOMPUTE_LEASE_SECONDS must be at most 3600').default(30),
    LOG_REQUESTS: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  })
  .superRefine((v, ctx) => {
    if (v.NODE_ENV !== 'production') return;
    // In production every secret comes from the environment, and none may be a value published in this repository.
    for (const name of ['SESSION_SECRET', 'STRIPE_SECRET_KEY', 'STRIPE_WEBHOOK_SECRET'] as const) {
      const value = v[name];
      if (value === undefined) ctx.addIssue({ code: 'custom', path: [name], message: `${name} must be set in the environment in production` });
      else if (KNOWN_NON_SECRETS.has(value)) ctx.addIssue({ code: 'custom', path: [name], message: `${name} is a development or test value and may not be used in production` });
    }
  })
  .transform((v) => ({ ...v, STRIPE_SECRET_KEY: v.STRIPE_SECRET_KEY ?? DEV_DEFAULTS.STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET: v.STRIPE_WEBHOOK_SECRET ?? DEV_DEFAULTS.STRIPE_WEBHOOK_SECRET }));

export type Env = z.output<typeof envSchema>;

export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    throw new Error(`Configuration error: ${first.path.join('.')}: ${first.message}`);
  }
  return parsed.data;
}

// Brings up everything Bumpboard needs for one environment (the app, or the test instance): database, migrations,
import { resolve } from 'node:path';
// demo, the local mail and payments stand-ins, and the server.
import { existsSync } from 'node:fs';
import { startPrivateMariadb } from './mariadb.mjs';
import { persistentSecret } from './secrets.mjs';
import { run, startChild, waitForHttp } from './processes.mjs';
import { say } from './log.mjs';

const TSX = 'node_modules/.bin/tsx';

export async function startDatabase({ local, dbPort }) {
  if (process.env.DATABASE_URL) {
    say('db', 'using DATABASE_URL');
    return { url: process.env.DATABASE_URL, stop: async () => {} };
  }
  return startPrivateMariadb({ baseDir: `${local}/db`, port: dbPort });
}

export function migrateAndLoadDemo(databaseUrl, { local, demo = true } = {}) {
  if (run(TSX, ['server/src/db/migrate.ts'], { DATABASE_URL: databaseUrl }) !== 0) throw new Error('migrations failed; see above');
  if (demo && process.env.NODE_ENV !== 'production') {
    const env = { DATABASE_URL: databaseUrl, DEMO_KEYS_FILE: `${local}/demo-feed-keys.json` };
    if (run(TSX, ['server/src/demo/cli.ts'], env) !== 0) throw new Error('loading the demo failed; see above');
  }
}

/** Environment shared by the server and the stand-ins, from the ports of this environment. */
export function serviceEnv({ local, ports, databaseUrl, databaseSocket }) {
  const stripeWebhookSecret = persistentSecret(`${local}/stripe-webhook-secret`).replace(/^/, 'whsec_');
  return {
    DATABASE_URL: databaseUrl,
    // The private MariaDB runs beside the server: its socket is cheaper per statement than loopback TCP.
    ...(databaseSocket ? { DATABASE_SOCKET: resolve(databaseSocket) } : {}),
    PORT: String(ports.app),
    APP_BASE_URL: `http://127.0.0.1:${ports.app}`,
    SESSION_SECRET: persistentSecret(`${local}/session-secret`),
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(ports.smtp),
    STRIPE_API_URL: `http://127.0.0.1:${ports.payments}`,
    STRIPE_SECRET_KEY: 'sk_test_local_stand_in',
    STRIPE_WEBHOOK_SECRET: stripeWebhookSecret,
    MAIL_FAKE_SMTP_PORT: String(ports.smtp),
    MAIL_FAKE_HTTP_PORT: String(ports.mail),
    MAIL_FAKE_DATA_DIR: `${local}/mail-fake`,
    PAYMENTS_FAKE_PORT: String(ports.payments),
    PAYMENTS_FAKE_DATA_DIR: `${local}/payments-fake`,
    PAYMENTS_FAKE_WEBHOOK_URL: `http://127.0.0.1:${ports.app}/api/payments/webhook`,
    PAYMENTS_FAKE_WEBHOOK_SECRET: stripeWebhookSecret,
    DEMO_KEYS_FILE: `${local}/demo-feed-keys.json`,
    MAIL_FAKE_URL: `http://127.0.0.1:${ports.mail}`,
  };
}

export async function startServices(env, { dev = false, quiet = false, standIns = true } = {}) {
  if (standIns) {
    startChild('mail', TSX, ['mail-fake/src/main.ts'], { env, quiet });
    if (existsSync('payments-fake/src/main.ts')) startChild('payments', TSX, ['payments-fake/src/main.ts'], { env, quiet });
  }
  const serverArgs = dev ? ['watch', '--clear-screen=false', 'server/src/main.ts'] : ['server/src/main.ts'];
  startChild('server', TSX, serverArgs, { env, quiet });
  await waitForHttp(`http://127.0.0.1:${env.PORT}/api/health`);
  if (standIns) await waitForHttp(`http://127.0.0.1:${env.MAIL_FAKE_HTTP_PORT}/api/health`);
  // The demo simulator plays check-ins through the feed API; SIMULATOR=off leaves the demo still.
  if ((env.SIMULATOR ?? process.env.SIMULATOR ?? 'on') !== 'off' && existsSync(env.DEMO_KEYS_FILE)) {
    startChild('simulator', TSX, ['server/src/demo/simulator.ts'], { env, quiet });
  }
}

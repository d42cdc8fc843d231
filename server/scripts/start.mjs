// `npm start`: everything from a fresh clone to a running Bumpboard, and a clean stop on Ctrl-C or SIGTERM.
// `npm run dev`: the same with hot reload (server restarts on change; the client through Vite).
import { ensureDependencies } from './lib/deps.mjs';
import { buildClientIfStale } from './lib/client-build.mjs';
import { migrateAndLoadDemo, serviceEnv, startDatabase, startServices } from './lib/stack.mjs';
import { startChild, stopChildren } from './lib/processes.mjs';
import { say } from './lib/log.mjs';
import { startPrivateRedis } from './lib/redis.mjs';
import { demoDataIn, productionEnvProblems } from './lib/production.mjs';

const dev = process.argv.includes('--dev');
const production = process.env.NODE_ENV === 'production';
const startedAt = Date.now();
const local = '.local';
const appPort = Number(process.env.PORT ?? 4600);
const ports = { app: appPort, mail: appPort + 1, payments: appPort + 2, smtp: appPort + 25, db: appPort + 10 };

let db;
let stopping = false;
async function stop(code = 0) {
  if (stopping) return;
  stopping = true;
  say('start', 'stopping…');
  await stopChildren();
  await db?.stop();
  say('start', 'stopped');
  process.exit(code);
}
process.on('SIGINT', () => void stop(0));
process.on('SIGTERM', () => void stop(0));

/**
 * Production runs on what the operator gives it and nothing this repository makes up: refuse before anything starts
 * when a secret is missing or shipped, or when the database has ever held the demo.
 */
async function refuseUnsafeProduction() {
  const problems = productionEnvProblems(process.env);
  if (!problems.length) {
    const demo = await demoDataIn(process.env.DATABASE_URL);
    if (demo.length) problems.push(`the database holds demo data (${demo.join(', ')}); use a database that never had the demo loaded`);
  }
  if (!problems.length) return;
  console.error(`[start] refused to start with NODE_ENV=production:\n${problems.map((p) => `  - ${p}`).join('\n')}`);
  process.exit(1);
}

try {
  ensureDependencies();
  if (production) {
    if (dev) throw new Error('npm run dev is for development; run npm start with NODE_ENV=production');
    await refuseUnsafeProduction();
  }
  db = await startDatabase({ local, dbPort: ports.db });
  migrateAndLoadDemo(db.url, { local, demo: !production });
  if (!dev) buildClientIfStale();
  // In production every secret and address comes from the environment; the stand-ins and the simulator stay off.
  const env = production ? { ...process.env, PORT: String(appPort), SIMULATOR: 'off' } : serviceEnv({ local, ports, databaseUrl: db.url, databaseSocket: db.socket });
  // CLUSTER=1 without REDIS_URL: a private Redis on loopback, for app processes started beside this one (README).
  if (process.env.CLUSTER === '1' && !process.env.REDIS_URL) env.REDIS_URL = (await startPrivateRedis({ port: appPort + 30, dir: `${local}/redis` })).url;
  await startServices(env, { dev, standIns: !production });
  if (dev) startChild('vite', 'node_modules/.bin/vite', ['--strictPort'], { env: { BUMPBOARD_API_URL: `http://127.0.0.1:${ports.app}` } });
  const appUrl = dev ? 'http://127.0.0.1:5173' : `http://127.0.0.1:${ports.app}`;
  if (production) {
    console.log(`\n  Bumpboard is running in production on port ${appPort} (ready in ${((Date.now() - startedAt) / 1000).toFixed(1)} s). Ctrl-C stops it.\n`);
  } else console.log(`
  Bumpboard is running (ready in ${((Date.now() - startedAt) / 1000).toFixed(1)} s)
    App                 ${appUrl}
    Mail catcher        http://127.0.0.1:${ports.mail}   (SMTP on 127.0.0.1:${ports.smtp})
    Payments stand-in   http://127.0.0.1:${ports.payments}
  Demo sign-ins (invented data; password: bumpboard-demo-2026)
    agent@bumpboard.test · supervisor@bumpboard.test · finance@bumpboard.test · admin@bumpboard.test
  Ctrl-C stops everything.
`);
} catch (err) {
  console.error(`[start] ${err instanceof Error ? err.message : err}`);
  await stop(1);
}

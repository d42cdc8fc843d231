// `npm start`: everything from a fresh clone to a running Bumpboard, and a clean stop on Ctrl-C or SIGTERM.
// `npm run dev`: the same with hot reload (server restarts on change; the client through Vite).
import { ensureDependencies } from './lib/deps.mjs';
import { buildClientIfStale } from './lib/client-build.mjs';
import { migrateAndLoadDemo, serviceEnv, startDatabase, startServices } from './lib/stack.mjs';
import { startChild, stopChildren } from './lib/processes.mjs';
import { say } from './lib/log.mjs';

const dev = process.argv.includes('--dev');
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

try {
  ensureDependencies();
  db = await startDatabase({ local, dbPort: ports.db });
  migrateAndLoadDemo(db.url, { local });
  if (!dev) buildClientIfStale();
  const env = serviceEnv({ local, ports, databaseUrl: db.url });
  await startServices(env, { dev });
  if (dev) startChild('vite', 'node_modules/.bin/vite', ['--strictPort'], { env: { BUMPBOARD_API_URL: `http://127.0.0.1:${ports.app}` } });
  const appUrl = dev ? 'http://127.0.0.1:5173' : `http://127.0.0.1:${ports.app}`;
  console.log(`
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

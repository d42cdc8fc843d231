// `npm run bench`: the forecast engine bench, then the feed-latency bench against a private stack of its own (data
// under .local/bench, ports from BENCH_PORT, default 4900: app 4900, mail 4901, payments 4902, db 4910, SMTP 4925),
// reset on every run and stopped afterwards, even on error or Ctrl-C. Prints figures and asserts nothing: the exit
// code is non-zero only when a step could not run. BENCH_SECONDS and BENCH_RATE pass through to the feed bench.
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { ensureDependencies } from './lib/deps.mjs';
import { startPrivateMariadb } from './lib/mariadb.mjs';
import { migrateAndLoadDemo, serviceEnv } from './lib/stack.mjs';
import { startChild, stopChildren, waitForHttp } from './lib/processes.mjs';
import { say } from './lib/log.mjs';
import { buildClientIfStale } from './lib/client-build.mjs';
import { finishedChild } from './bench/finished-child.mjs';
import { printSummary } from './bench/summary.mjs';

const TSX = 'node_modules/.bin/tsx';
const local = '.local/bench';
const base = Number(process.env.BENCH_PORT ?? 4900);
const ports = { app: base, mail: base + 1, payments: base + 2, smtp: base + 25, db: base + 10 };
const resultFile = `${local}/feed-latency.json`;
const steps = [];
let db;
let interrupted = false;
/** The bench child now running (forecast or feed), stopped before the stack on Ctrl-C. */
let benchChild = null;

async function runBench(name, script, env = {}) {
  benchChild = startChild(name, TSX, [script], { env });
  try {
    return await finishedChild(benchChild);
  } finally {
    benchChild = null;
  }
}

async function stopBenchChild() {
  const child = benchChild;
  if (!child || child.exitCode !== null) return;
  await new Promise((resolve) => {
    const timer = setTimeout(resolve, 10_000);
    child.once('close', () => { clearTimeout(timer); resolve(); });
    child.kill('SIGTERM');
  });
}

async function step(name, fn) {
  if (interrupted) return false;
  const t0 = Date.now();
  say('bench', `── ${name}`);
  let ok = false;
  let detail = '';
  try {
    detail = (await fn()) ?? '';
    ok = true;
  } catch (err) {
    if (interrupted) detail = 'interrupted';
    else console.error(`[bench] ${name}: ${err instanceof Error ? err.message : err}`);
  }
  steps.push({ name, ok, seconds: (Date.now() - t0) / 1000, detail });
  return ok;
}

/** The forecast bench's own lines that say the most, for the summary. */
function forecastHeadline(lines) {
  const pick = (prefix) => lines.find((l) => l.startsWith(prefix))?.slice(prefix.length).trim();
  const engine = pick('engine showUpDistribution ms (median of 31)');
  const ratio = pick('engine / plain (target <= 2)');
  return engine ? `engine ${engine} ms per 850-person flight, ${ratio} x the plain DP` : '';
}

async function main() {
  ensureDependencies();
  await step('forecast engine bench', async () => {
    const { code, lines } = await runBench('forecast', 'server/scripts/bench/forecast.bench.ts');
    if (code !== 0) throw new Error(`forecast.bench.ts exited with ${code}`);
    return forecastHeadline(lines);
  });

  let env;
  let server;
  const stackUp = await step('bench stack (MariaDB, migrations, demo, server)', async () => {
    // The browser sample loads the desk from the built client the server serves.
    if (process.env.BENCH_BROWSER !== '0') buildClientIfStale();
    db = await startPrivateMariadb({ baseDir: `${local}/db`, port: ports.db });
    db.resetDatabase();
    migrateAndLoadDemo(db.url, { local });
    // No simulator: the only feed traffic is the bench's own, so every count it checks is its own doing.
    env = { ...serviceEnv({ local, ports, databaseUrl: db.url, databaseSocket: db.socket }), SIMULATOR: 'off' };
    server = startChild('server', TSX, [...(process.env.BENCH_PROFILE_DIR ? ['--cpu-prof', `--cpu-prof-dir=${process.env.BENCH_PROFILE_DIR}`] : []), 'server/src/main.ts'], { env });
    await waitForHttp(`http://127.0.0.1:${ports.app}/api/health`);
    return `app on 127.0.0.1:${ports.app}, MariaDB on 127.0.0.1:${ports.db}`;
  });
  if (!stackUp) return;

  await step('feed latency bench', async () => {
    rmSync(resultFile, { force: true });
    const pidFile = `${local}/db/run/mariadb.pid`;
    const feedEnv = {
      BENCH_APP_URL: `http://127.0.0.1:${ports.app}`,
      DATABASE_URL: db.url,
      BENCH_SERVER_PID: String(server.pid),
      BENCH_DB_PID: existsSync(pidFile) ? readFileSync(pidFile, 'utf8').trim() : '',
      BENCH_RESULT_FILE: resultFile,
    };
    const { code } = await runBench('feed', 'server/scripts/bench/feed-latency.bench.ts', feedEnv);
    if (code !== 0) throw new Error(`feed-latency.bench.ts exited with ${code}`);
    return existsSync(resultFile) ? JSON.parse(readFileSync(resultFile, 'utf8')) : '';
  });
}

function onSignal(signal) {
  if (interrupted) return;
  interrupted = true;
  say('bench', `${signal}: stopping the bench stack…`);
  // The load goes first, so the server is not stopped under it; no further step starts, and the clean-up below
  // stops MariaDB and prints the summary.
  void stopBenchChild().then(() => stopChildren());
}
process.on('SIGINT', () => onSignal('SIGINT'));
process.on('SIGTERM', () => onSignal('SIGTERM'));

try {
  await main();
} catch (err) {
  console.error(`[bench] ${err instanceof Error ? err.message : err}`);
  steps.push({ name: 'bench', ok: false, seconds: 0, detail: '' });
} finally {
  // Everything this script started, by PID: the children, then MariaDB (whatever step was running or interrupted).
  await stopChildren();
  await db?.stop();
  printSummary(steps);
  process.exitCode = interrupted ? 130 : steps.every((s) => s.ok) ? 0 : 1;
}

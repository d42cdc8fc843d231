// The bench's knobs, from the environment, each checked with a message naming the variable and its rule.
import { randomBytes } from 'node:crypto';

export interface FeedBenchSettings {
  appUrl: string;
  databaseUrl: string;
  seconds: number;
  rate: number;
  flights: number;
  clients: number;
  sessions: number;
  serverPid?: number;
  dbPid?: number;
  resultFile?: string;
  /** How the consoles react to notices: as today's client (patch) or as the client before (refetch everything). */
  clientModel: 'patch' | 'refetch';
  /** One headless Chromium on the desk of an extra flight, timing POST to the count changing in its DOM. */
  browser: boolean;
  /** Seconds of each read-throughput run after the load (0 skips it). */
  throughputSeconds: number;
  /** Keeps event ids unique when the bench runs twice against one database. */
  runId: string;
}

const LOOPBACK = new Set(['127.0.0.1', 'localhost', '[::1]']);

function whole(env: NodeJS.ProcessEnv, name: string, fallback: number, min: number, max: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < min || n > max) throw new Error(`${name} must be a whole number from ${min} to ${max} (got "${raw}")`);
  return n;
}

function optionalPid(env: NodeJS.ProcessEnv, name: string): number | undefined {
  return env[name] ? whole(env, name, 0, 1, 2 ** 22) : undefined;
}

function clientModel(raw: string | undefined): 'patch' | 'refetch' {
  if (raw === undefined || raw === '' || raw === 'patch') return 'patch';
  if (raw === 'refetch') return 'refetch';
  throw new Error(`BENCH_CLIENT_MODEL must be "patch" or "refetch" (got "${raw}")`);
}

export function readSettings(env: NodeJS.ProcessEnv): FeedBenchSettings {
  const appUrl = (env.BENCH_APP_URL ?? 'http://127.0.0.1:4900').replace(/\/$/, '');
  let host: string;
  try {
    host = new URL(appUrl).hostname;
  } catch {
    throw new Error(`BENCH_APP_URL must be a URL such as http://127.0.0.1:4900 (got "${appUrl}")`);
  }
  // Load goes to this machine only.
  if (!LOOPBACK.has(host)) throw new Error(`BENCH_APP_URL must point at loopback (127.0.0.1, localhost or [::1]); got host "${host}"`);
  const databaseUrl = env.DATABASE_URL;
  if (!databaseUrl || !/^(mariadb|mysql):\/\//.test(databaseUrl)) throw new Error('DATABASE_URL must be set to the bench database (mariadb://…)');
  const dbHost = new URL(databaseUrl).hostname;
  if (!LOOPBACK.has(dbHost)) throw new Error(`DATABASE_URL must point at loopback; got host "${dbHost}"`);
  return {
    appUrl,
    databaseUrl,
    seconds: whole(env, 'BENCH_SECONDS', 60, 1, 600),
    rate: whole(env, 'BENCH_RATE', 200, 1, 5000),
    flights: whole(env, 'BENCH_FLIGHTS', 20, 1, 200),
    clients: whole(env, 'BENCH_CLIENTS', 300, 1, 5000),
    sessions: whole(env, 'BENCH_SESSIONS', 5, 1, 50),
    serverPid: optionalPid(env, 'BENCH_SERVER_PID'),
    dbPid: optionalPid(env, 'BENCH_DB_PID'),
    resultFile: env.BENCH_RESULT_FILE || undefined,
    clientModel: clientModel(env.BENCH_CLIENT_MODEL),
    browser: whole(env, 'BENCH_BROWSER', 1, 0, 1) === 1,
    throughputSeconds: whole(env, 'BENCH_THROUGHPUT_SECONDS', 5, 0, 60),
    runId: `${Date.now().toString(36)}${randomBytes(3).toString('hex')}`,
  };
}

// What the fault tests stand on: a MariaDB of their own (so killing it disturbs no other suite), the server as a real
// process (node with tsx, as `npm start` runs it, so SIGKILL means what it means in production), and free ports.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import path from 'node:path';
import { vi } from 'vitest';
import { startPrivateMariadb, type PrivateMariadb } from '../../server/scripts/lib/mariadb.mjs';

export async function freePort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as { port: number }).port;
  await new Promise((resolve) => server.close(resolve));
  return port;
}

export interface FaultDatabase {
  url: string;
  /** SIGKILL of mariadbd: no clean shutdown, InnoDB recovers from its log at the next start. */
  crash(): void;
  /** Starts it again on the same port and data; resolves once it answers. */
  restart(): Promise<void>;
  stop(): Promise<void>;
}

/** A private MariaDB under .local/test/`name` (faults-db unless named) on a port of its own, emptied and migrated. */
export async function startFaultDatabase(name = 'faults-db'): Promise<FaultDatabase> {
  const baseDir = path.resolve('.local/test', name);
  const port = await freePort();
  let db: PrivateMariadb = await startPrivateMariadb({ baseDir, port });
  db.resetDatabase();
  const migrated = spawnSync(process.execPath, ['--import', 'tsx', 'server/src/db/migrate.ts'], { env: { ...process.env, DATABASE_URL: db.url }, encoding: 'utf8' });
  if (migrated.status !== 0) throw new Error(`migrations failed on the fault database: ${migrated.stderr || migrated.stdout}`);
  return {
    url: db.url,
    crash() {
      const pid = Number(readFileSync(path.join(baseDir, 'run', 'mariadb.pid'), 'utf8').trim());
      process.kill(pid, 'SIGKILL');
    },
    async restart() {
      await vi.waitFor(() => {
        // The killed server's socket file stays behind; the start routine pings before it spawns, so wait until no
        // one answers on it.
        const alive = spawnSync('mariadb-admin', ['--no-defaults', `--socket=${db.socket}`, '-uroot', '--silent', 'ping'], { stdio: 'ignore' });
        if (alive.status === 0) throw new Error('the killed MariaDB still answers');
      }, { timeout: 15_000, interval: 100 });
      db = await startPrivateMariadb({ baseDir, port });
    },
    stop: () => db.stop(),
  };
}

export interface ServerProcess {
  baseUrl: string;
  child: ChildProcess;
  /** Everything the process printed, for the checks that nothing secret or foreign reached its log. */
  output(): string;
  kill(signal: NodeJS.Signals): Promise<void>;
}

/**
 * The server as `npm start` runs it, one process, its workers inside; resolves once it answers its health route.
 * `env.PORT` keeps a port across restarts; without it a free one is taken.
 */
export async function startServerProcess(env: Record<string, string>): Promise<ServerProcess> {
  const port = env.PORT ? Number(env.PORT) : await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/src/main.ts'], {
    env: { ...process.env, NODE_ENV: 'test', HOST: '127.0.0.1', STATIC_DIR: 'no-static-in-api-tests', ...env, PORT: String(port), APP_BASE_URL: baseUrl },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout!.on('data', (d: Buffer) => (out += d.toString()));
  child.stderr!.on('data', (d: Buffer) => (out += d.toString()));
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  await vi.waitFor(async () => {
    if (child.exitCode !== null) throw new Error(`the server stopped during start-up:\n${out}`);
    const res = await fetch(`${baseUrl}/api/health`);
    if (!res.ok) throw new Error(`health ${res.status}`);
  }, { timeout: 120_000, interval: 200 });
  return {
    baseUrl,
    child,
    output: () => out,
    async kill(signal) {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill(signal);
      await exited;
    },
  };
}

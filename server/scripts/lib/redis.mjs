// A private Redis on loopback for running several app processes (socket.io's Redis adapter): Debian's redis-server,
// installed when missing like MariaDB, started by our own scripts with no persistence (it only relays messages), never
// the system service.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import { resolve } from 'node:path';
import { aptInstall } from './mariadb.mjs';
import { say } from './log.mjs';
import { startChild } from './processes.mjs';

function redisBinary() {
  const r = spawnSync('sh', ['-c', 'command -v redis-server'], { encoding: 'utf8' });
  if (r.status === 0) return r.stdout.trim();
  return existsSync('/usr/bin/redis-server') ? '/usr/bin/redis-server' : null;
}

/** Installs redis-server from Debian when it is missing and we are allowed to; otherwise stops with one clear line. */
export function ensureRedisInstalled() {
  if (redisBinary()) return redisBinary();
  if (process.getuid?.() !== 0) throw new Error('Redis is not installed. Run: sudo apt-get install -y redis-server  (or set REDIS_URL to a Redis you already run)');
  say('redis', 'installing redis-server from Debian (one time)…');
  aptInstall(['redis-server']);
  const bin = redisBinary();
  if (!bin) throw new Error('redis-server did not install. Run: apt-get install -y redis-server');
  return bin;
}

/** Starts Redis on 127.0.0.1:`port` (a child of this script, stopped with it) and waits until it answers. */
export async function startPrivateRedis({ port, dir }) {
  const bin = ensureRedisInstalled();
  const data = resolve(dir);
  mkdirSync(data, { recursive: true });
  const child = startChild('redis', bin, ['--bind', '127.0.0.1', '--port', String(port), '--save', '', '--appendonly', 'no', '--dir', data, '--protected-mode', 'yes'], { quiet: true });
  const url = `redis://127.0.0.1:${port}`;
  for (let i = 0; i < 100; i++) {
    const r = spawnSync('redis-cli', ['-h', '127.0.0.1', '-p', String(port), 'ping'], { encoding: 'utf8' });
    if (r.stdout?.trim() === 'PONG') return { url, child };
    await new Promise((done) => setTimeout(done, 100));
  }
  throw new Error(`redis-server did not answer on 127.0.0.1:${port}`);
}

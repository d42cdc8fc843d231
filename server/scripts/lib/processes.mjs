// Children of the start and test scripts: spawned by PID (node_modules/.bin/tsx directly, never through npx, so a
// signal reaches the real process), all stopped together on exit.
import { spawn, spawnSync } from 'node:child_process';
import { say } from './log.mjs';

const children = new Set();

export function startChild(name, command, args, { env = {}, quiet = false } = {}) {
  const child = spawn(command, args, { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
  const relay = (stream, out) => stream.on('data', (chunk) => {
    if (quiet) return;
    for (const line of String(chunk).split('\n')) if (line.trim()) out.write(`[${name}] ${line.replace(/^\[[a-z-]+\] /, '')}\n`);
  });
  relay(child.stdout, process.stdout);
  relay(child.stderr, process.stderr);
  children.add(child);
  child.on('exit', (code, signal) => {
    children.delete(child);
    if (!stopping && code !== 0) say(name, `exited (${signal ?? code})`);
  });
  return child;
}

let stopping = false;
export async function stopChildren() {
  stopping = true;
  const waits = [...children].map((c) => new Promise((resolve) => {
    if (c.exitCode !== null) return resolve();
    const timer = setTimeout(() => c.kill('SIGKILL'), 8000);
    c.on('exit', () => { clearTimeout(timer); resolve(); });
    c.kill('SIGTERM');
  }));
  await Promise.all(waits);
}

/** Runs a command to completion with inherited output; returns its exit code. */
export function run(command, args, env = {}) {
  const r = spawnSync(command, args, { stdio: 'inherit', env: { ...process.env, ...env } });
  return r.status ?? 1;
}

export async function waitForHttp(url, timeoutMs = 60_000) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${url} did not answer within ${timeoutMs / 1000}s`);
}

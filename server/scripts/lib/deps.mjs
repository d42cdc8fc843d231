// Installs npm dependencies when node_modules is missing or older than the lock file, so a fresh clone needs no
// hand-run step.
import { existsSync, statSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { say } from './log.mjs';

export function ensureDependencies() {
  const marker = 'node_modules/.package-lock.json';
  const stale = !existsSync(marker) || statSync('package-lock.json').mtimeMs > statSync(marker).mtimeMs;
  if (!stale) return;
  say('deps', 'installing npm dependencies (npm ci)…');
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund', '--loglevel=error'], { stdio: 'inherit' });
  if (r.status !== 0) throw new Error('npm ci failed; see the lines above');
}

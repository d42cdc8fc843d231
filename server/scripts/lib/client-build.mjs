// Builds the client only when a source file is newer than the last build, so a second start takes seconds.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { run } from './processes.mjs';
import { say } from './log.mjs';

function newestMtime(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestMtime(p) : statSync(p).mtimeMs);
  }
  return newest;
}

export function buildClientIfStale() {
  const marker = 'dist/client/index.html';
  const sources = Math.max(newestMtime('client'), newestMtime('shared'), statSync('vite.config.ts').mtimeMs, statSync('package-lock.json').mtimeMs);
  if (existsSync(marker) && statSync(marker).mtimeMs > sources) return;
  say('build', 'building the client…');
  if (run('node_modules/.bin/vite', ['build', '--logLevel', 'warn']) !== 0) throw new Error('the client build failed; see above');
}

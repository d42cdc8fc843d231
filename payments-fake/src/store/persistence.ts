import { closeSync, fsyncSync, mkdirSync, openSync, readFileSync, renameSync, writeSync, existsSync } from 'node:fs';
import { join } from 'node:path';

const STATE_FILE = 'state.json';
let tmpCounter = 0;

/**
 * Writes the whole snapshot to a temporary file, flushes it, then renames it over the old one.
 * A rename within one directory is atomic, so a crash leaves either the old or the new state, never half of one.
 */
export function writeSnapshot(dataDir: string, snapshot: unknown): void {
  mkdirSync(dataDir, { recursive: true });
  tmpCounter += 1;
  const target = join(dataDir, STATE_FILE);
  const tmp = join(dataDir, `${STATE_FILE}.${process.pid}.${tmpCounter}.tmp`);
  const fd = openSync(tmp, 'w');
  try {
    writeSync(fd, JSON.stringify(snapshot));
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
  renameSync(tmp, target);
}

/** Returns the parsed snapshot, or null when the data dir has none yet. A corrupt file is an error, never a silent wipe. */
export function readSnapshot(dataDir: string): unknown {
  const file = join(dataDir, STATE_FILE);
  if (!existsSync(file)) return null;
  const text = readFileSync(file, 'utf8');
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new Error(`payments-fake: ${file} is not valid JSON (${(error as Error).message}); move it away to start empty.`);
  }
}

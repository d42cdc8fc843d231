// `npm test`: a separate test instance (own data folder and ports, so it runs beside `npm start`), then lint,
// type-check, unit tests, API tests against the real MariaDB, and end-to-end tests in Debian's Chromium.
// Every step runs; the summary is the last thing printed; the exit code is non-zero if any step failed.
import { existsSync, mkdirSync, rmSync } from 'node:fs';
import { resolve } from 'node:path';
import { countResults, summaryLine } from './lib/test-results.mjs';
import { ensureDependencies } from './lib/deps.mjs';
import { aptInstall } from './lib/mariadb.mjs';
import { ensureRedisInstalled } from './lib/redis.mjs';
import { buildClientIfStale } from './lib/client-build.mjs';
import { migrateAndLoadDemo, serviceEnv, startDatabase, startServices } from './lib/stack.mjs';
import { run, stopChildren } from './lib/processes.mjs';
import { say } from './lib/log.mjs';

const local = '.local/test';
// TEST_PORT moves the whole test instance (default 4700: app 4700, mail 4701, payments 4702, db 4710, SMTP 4725).
const base = Number(process.env.TEST_PORT ?? 4700);
const ports = { app: base, mail: base + 1, payments: base + 2, smtp: base + 25, db: base + 10 };
const results = [];
let db;
// `npm test -- e2e tests/e2e/a.spec.ts` runs the set-up and the named steps only (lint, typecheck, unit, api, e2e),
// the files after them passed to that runner: for working on one part; CI runs everything.
const argv = process.argv.slice(2);
const STEPS = ['lint', 'typecheck', 'unit', 'api', 'e2e'];
const onlySteps = argv.filter((a) => STEPS.includes(a));
const runnerFiles = argv.filter((a) => !STEPS.includes(a));
const wanted = (name) => onlySteps.length === 0 || onlySteps.includes(name);
// Each test runner writes its JSON report here; the last line of the run adds them all up.
const reports = resolve(local, 'reports');
const report = (name) => resolve(reports, `${name}.json`);
const vitestJson = (name) => ['--reporter=default', '--reporter=json', `--outputFile.json=${report(name)}`];

async function step(name, fn, reportName) {
  const t0 = Date.now();
  say('test', `── ${name}`);
  let ok = false;
  try {
    ok = (await fn()) !== false;
  } catch (err) {
    console.error(`[test] ${name}: ${err instanceof Error ? err.message : err}`);
  }
  results.push({ name, ok, seconds: (Date.now() - t0) / 1000, report: reportName && report(reportName) });
  return ok;
}

function ensureChromium() {
  if (existsSync('/usr/bin/chromium')) return;
  say('test', 'installing Chromium from Debian (one time)…');
  aptInstall(['chromium']);
  if (!existsSync('/usr/bin/chromium')) throw new Error('Chromium is not installed. Run: apt-get install -y chromium');
}

async function main() {
  const setupOk = await step('set-up (dependencies, test database, migrations, demo)', async () => {
    ensureDependencies();
    rmSync(reports, { recursive: true, force: true });
    mkdirSync(reports, { recursive: true });
    db = await startDatabase({ local, dbPort: ports.db });
    if (!process.env.DATABASE_URL) db.resetDatabase();
    rmSync(`${local}/mail-fake`, { recursive: true, force: true });
    rmSync(`${local}/payments-fake`, { recursive: true, force: true });
    migrateAndLoadDemo(db.url, { local });
    // The tests of several app processes start a Redis of their own; installed here once, like MariaDB.
    if (wanted('api')) ensureRedisInstalled();
  });
  if (wanted('lint')) await step('lint (ESLint)', () => run('node_modules/.bin/eslint', ['--config', 'tests/lint/eslint.config.js', '.']) === 0);
  if (wanted('typecheck')) await step('type-check (tsc)', () => run('node_modules/.bin/tsc', ['-p', 'tsconfig.json', '--noEmit']) === 0);
  if (wanted('unit')) await step('unit tests (vitest)', () => run('node_modules/.bin/vitest', ['run', '--project', 'unit', '--project', 'client', ...vitestJson('unit'), ...runnerFiles]) === 0, 'unit');
  if (!setupOk) return;
  const env = { ...serviceEnv({ local, ports, databaseUrl: db.url }), NODE_ENV: 'test', SIMULATOR: 'off' };
  if (wanted('api')) await step('API tests against MariaDB (vitest)', () => run('node_modules/.bin/vitest', ['run', '--project', 'api', ...vitestJson('api'), ...runnerFiles], env) === 0, 'api');
  if (wanted('e2e')) await step('end-to-end tests in Chromium (Playwright)', async () => {
    ensureChromium();
    buildClientIfStale();
    // The API tests changed data; the browser tests start from a fresh demo.
    if (!process.env.DATABASE_URL) db.resetDatabase();
    migrateAndLoadDemo(db.url, { local });
    await startServices(env, { quiet: !process.env.VERBOSE });
    return run('node_modules/.bin/playwright', ['test', '--config', 'tests/e2e/playwright.config.ts', ...runnerFiles], { ...env, E2E_JSON_REPORT: report('e2e') }) === 0;
  }, 'e2e');
}

try {
  await main();
} finally {
  await stopChildren();
  await db?.stop();
  const width = Math.max(...results.map((r) => r.name.length));
  console.log('\n  Bumpboard test summary');
  for (const r of results) console.log(`    ${r.ok ? 'PASS' : 'FAIL'}  ${r.name.padEnd(width)}  ${r.seconds.toFixed(1)} s`);
  const failedSteps = results.filter((r) => !r.ok).length;
  // The one plain line: every test of every runner, from their JSON reports; a step that failed without a report
  // of its own (lint, type-check, set-up, a runner that crashed) counts as one failure, so a red run never reads 0.
  console.log(`\n${summaryLine(results.map((r) => countResults(r)))}`);
  process.exitCode = failedSteps ? 1 : 0;
}

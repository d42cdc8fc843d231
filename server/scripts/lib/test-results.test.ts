// The last line of `npm test` adds up what the runners themselves report: the real vitest and Playwright JSON
// reporters run here on a throwaway suite of two passing, one failing and one skipped test each.
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { countResults, parseReport, summaryLine } from './test-results.mjs';

const bin = (name: string) => resolve('node_modules/.bin', name);
// Inside the repository (under the git-ignored .local/), so the throwaway suites resolve the installed runners.
mkdirSync('.local', { recursive: true });
const dir = mkdtempSync(resolve('.local', 'results-fixture-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('the summary line', () => {
  it('counts a real vitest JSON report', () => {
    writeFileSync(join(dir, 'sample.test.mjs'), [
      "import { it, expect } from 'vitest';",
      "it('one', () => expect(1).toBe(1));",
      "it('two', () => expect(2).toBe(2));",
      "it('three', () => expect(3).toBe(4));",
      "it.skip('four', () => {});",
    ].join('\n'));
    writeFileSync(join(dir, 'broken.test.mjs'), "import './does-not-exist.mjs';\n");
    // Its own config, or vitest would find the repository's one further up and run its projects instead.
    writeFileSync(join(dir, 'vitest.config.mjs'), "export default { test: { include: ['*.test.mjs'] } };\n");
    const out = join(dir, 'vitest.json');
    spawnSync(bin('vitest'), ['run', '--root', dir, '--reporter=json', `--outputFile=${out}`], { cwd: dir, encoding: 'utf8' });
    // The file that cannot even load counts as one failure: it ran none of its tests.
    expect(parseReport(JSON.parse(readFileSync(out, 'utf8')))).toEqual({ passed: 2, failed: 2, skipped: 1 });
  }, 60_000);

  it('counts a real Playwright JSON report', () => {
    writeFileSync(join(dir, 'sample.spec.mjs'), [
      "import { test, expect } from '@playwright/test';",
      "test('one', () => expect(1).toBe(1));",
      "test('two', () => expect(2).toBe(2));",
      "test('three', () => expect(3).toBe(4));",
      "test.skip('four', () => {});",
    ].join('\n'));
    const out = join(dir, 'playwright.json');
    spawnSync(bin('playwright'), ['test', '--reporter=json', join(dir, 'sample.spec.mjs')], {
      cwd: dir, encoding: 'utf8', env: { ...process.env, PLAYWRIGHT_JSON_OUTPUT_NAME: out },
    });
    expect(parseReport(JSON.parse(readFileSync(out, 'utf8')))).toEqual({ passed: 2, failed: 1, skipped: 1 });
  }, 60_000);

  it('counts a failed step without a report (lint, type-check) as one failure, and prints one plain line', () => {
    const counts = [
      countResults({ name: 'lint', ok: false }),
      countResults({ name: 'type-check', ok: true }),
      { passed: 10, failed: 0, skipped: 0 },
    ];
    expect(summaryLine(counts)).toBe('10 passed, 1 failed');
    expect(summaryLine([{ passed: 3, failed: 0, skipped: 2 }])).toBe('3 passed, 0 failed, 2 skipped');
  });
});

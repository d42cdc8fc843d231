// Reads the JSON reports of vitest and Playwright and adds them up into the last line `npm test` prints.
import { existsSync, readFileSync } from 'node:fs';

/** vitest's JSON reporter (Jest's format): a file that failed to load has no test results but a failure message. */
function fromVitest(json) {
  const brokenFiles = (json.testResults ?? []).filter((f) => f.status === 'failed' && !(f.assertionResults ?? []).length).length;
  return {
    passed: json.numPassedTests ?? 0,
    failed: (json.numFailedTests ?? 0) + brokenFiles,
    skipped: (json.numPendingTests ?? 0) + (json.numTodoTests ?? 0),
  };
}

/** Playwright's JSON reporter: `expected` passed, `unexpected` failed, `flaky` passed on a retry. */
function fromPlaywright(json) {
  const s = json.stats ?? {};
  const broken = (json.errors ?? []).length && !s.expected && !s.unexpected ? 1 : 0;
  return { passed: (s.expected ?? 0) + (s.flaky ?? 0), failed: (s.unexpected ?? 0) + broken, skipped: s.skipped ?? 0 };
}

export function parseReport(json) {
  return 'stats' in json && 'suites' in json ? fromPlaywright(json) : fromVitest(json);
}

/** One step's counts: from its report when it wrote one, otherwise the step itself as one check. */
export function countResults(step) {
  if (step.report && existsSync(step.report)) {
    try {
      const counts = parseReport(JSON.parse(readFileSync(step.report, 'utf8')));
      // A runner that failed while every test it reports passed (a crash in teardown) still failed once.
      if (!step.ok && counts.failed === 0) counts.failed = 1;
      return counts;
    } catch {
      // An unreadable report: fall through to counting the step.
    }
  }
  return { passed: 0, failed: step.ok ? 0 : 1, skipped: 0 };
}

export function summaryLine(counts) {
  const total = counts.reduce((a, c) => ({ passed: a.passed + c.passed, failed: a.failed + c.failed, skipped: a.skipped + c.skipped }), { passed: 0, failed: 0, skipped: 0 });
  return `${total.passed} passed, ${total.failed} failed${total.skipped ? `, ${total.skipped} skipped` : ''}`;
}

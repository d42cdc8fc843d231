// Types for test-results.mjs (a plain Node script, run before dependencies exist), for its unit test.
export interface Counts { passed: number; failed: number; skipped: number }
export interface StepResult { name: string; ok: boolean; report?: string }
export function parseReport(json: unknown): Counts;
export function countResults(step: StepResult): Counts;
export function summaryLine(counts: Counts[]): string;

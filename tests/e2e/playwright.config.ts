import { defineConfig } from '@playwright/test';

// Debian's Chromium, never a downloaded browser; the flags keep it from reaching for the network this machine refuses.
export default defineConfig({
  testDir: '.',
  outputDir: '../../test-results/e2e',
  timeout: 60_000,
  workers: 1,
  // The JSON report feeds the one summary line of `npm test` (server/scripts/test.mjs).
  reporter: process.env.E2E_JSON_REPORT ? [['list'], ['json', { outputFile: process.env.E2E_JSON_REPORT }]] : [['list']],
  use: {
    baseURL: process.env.APP_BASE_URL ?? 'http://127.0.0.1:4700',
    viewport: { width: 1366, height: 900 },
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    },
  },
});

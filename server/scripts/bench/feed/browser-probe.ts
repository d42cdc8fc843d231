// One real browser on the Flight desk while the load runs: Debian's Chromium, headless, signed in with a bench
// session, on a flight the load does not drive. Each sample posts one check-in (or its cancellation) and times the
// feed POST until the desk's checked-in count in the page's DOM shows the new number.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from 'playwright-core';
import type { BenchFlight } from './fixture';
import type { createFeed } from './load';
import { percentile } from './stats';

export interface BrowserFigures {
  samples: number[];
  p50: number;
  max: number;
  timeouts: number;
}

const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const COUNT = '[data-testid="total-checked-in"]';

export interface BrowserProbe {
  /** Samples until `until` (epoch ms) or `samples` taken. */
  run(until: number, samples: number): Promise<BrowserFigures>;
  close(): Promise<void>;
}

export async function openBrowserProbe(opts: { appUrl: string; cookie: string; flight: BenchFlight; feed: ReturnType<typeof createFeed> }): Promise<BrowserProbe> {
  const dir = mkdtempSync(join(tmpdir(), 'bumpboard-bench-browser-'));
  const context = await chromium.launchPersistentContext(dir, { executablePath: '/usr/bin/chromium', headless: true, args: ARGS });
  const [name, value] = opts.cookie.split('=');
  await context.addCookies([{ name, value, url: opts.appUrl }]);
  const page = await context.newPage();
  await page.goto(`${opts.appUrl}/flights/${opts.flight.id}`);
  await page.waitForFunction((sel) => /^\d+$/.test(document.querySelector(sel)?.textContent ?? ''), COUNT, { timeout: 60_000 });
  const passenger = opts.flight.passengers[0];
  return {
    async run(until, wanted) {
      const samples: number[] = [];
      let timeouts = 0;
      while (samples.length + timeouts < wanted && Date.now() < until) {
        const shown = Number(await page.textContent(COUNT));
        passenger.checkedIn = !passenger.checkedIn;
        const expected = shown + (passenger.checkedIn ? 1 : -1);
        const t0 = Date.now();
        await opts.feed.post(opts.flight, passenger, passenger.checkedIn, t0);
        try {
          await page.waitForFunction(([sel, n]) => document.querySelector(sel as string)?.textContent === String(n), [COUNT, expected] as const, { timeout: 30_000, polling: 'raf' });
          samples.push(Date.now() - t0);
        } catch {
          timeouts++;
        }
        await new Promise((r) => setTimeout(r, 500));
      }
      return { samples, p50: percentile(samples, 50), max: percentile(samples, 100), timeouts };
    },
    async close() {
      await context.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

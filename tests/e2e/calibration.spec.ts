// The calibration screen as an admin works it: a training run started and followed to its end, the reliability
// diagram with its table, the scores against the hand-set profile, the oversale backtest, per station and per route;
// charts hidden from assistive technology hold nothing focusable (axe); the planner names the learned version.
// BOS is left on the hand-set profile it starts with, so no other spec's odds move.
import AxeBuilder from '@axe-core/playwright';
import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';

test('an admin trains the rates and reads their calibration for the station and a route', async ({ page }) => {
  test.setTimeout(180_000);
  await signIn(page, 'admin@bumpboard.test');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Calibration' }).click();
  await expect(page.getByRole('heading', { level: 1, name: /^Calibration · / })).toBeVisible();
  await page.goto('/calibration?station=BOS');
  await expect(page.getByRole('heading', { level: 1, name: 'Calibration · BOS' })).toBeVisible();

  await page.getByRole('button', { name: 'Retrain now' }).click();
  const progress = page.getByRole('progressbar', { name: /Training run \d+/ });
  await expect(progress).toBeVisible();
  await expect.poll(async () => progress.getAttribute('aria-valuenow'), { timeout: 150_000 }).toBe('100');
  await expect(page.getByText(/Latest version \d+: learned from \d+ closed flights/)).toBeVisible();

  await expect(page.getByRole('table', { name: /Predicted show probability three hours out .*all of BOS/ })).toBeVisible();
  await expect(page.getByRole('table', { name: /Show probabilities of \d+ held-out passengers/ }).getByRole('row', { name: /^Brier score/ })).toBeVisible();
  await expect(page.getByRole('table', { name: /Oversale odds on \d+ held-out flights/ }).getByRole('row', { name: /^Actual people beyond the seats/ })).toBeVisible();
  // The learned rates per check-in state and channel: checked in by 3 h out, over all channels and per channel.
  const segments = page.getByRole('table', { name: /Share of bookings that showed, by their check-in state/ });
  await expect(segments.getByRole('row', { name: /^3 h out checked in \d+\.\d %/ })).toBeVisible();
  await expect(segments.getByRole('columnheader', { name: 'corporate travel desk' })).toBeVisible();
  await segments.screenshot({ path: 'test-results/screenshots/calibration-segments.png' });

  await page.getByLabel('Show calibration for').selectOption('ORD');
  await expect(page.getByRole('table', { name: /Predicted show probability three hours out .*\(BOS–ORD/ })).toBeVisible();

  const axe = await new AxeBuilder({ page }).include('main').analyze();
  expect(axe.violations.filter((v) => ['aria-hidden-focus', 'svg-img-alt', 'table-duplicate-name', 'label'].includes(v.id))).toEqual([]);
  await shot(page, 'calibration-bos-ord');

  await page.getByRole('button', { name: /^Outcomes of ZZ \d+/ }).first().click();
  await expect(page.getByRole('table', { name: /Outcomes \(checked in at 24 h/ })).toBeVisible();
  await shot(page, 'calibration-outcomes');

  // The planner offers the route's learned rates and names their version (BOS stays on the hand-set profile).
  await page.goto('/planner?station=BOS');
  await page.getByLabel('To (IATA code)').fill('ORD');
  await expect(page.getByText(/Learned for BOS–ORD \(rates version \d+, not in use at the station\)/)).toBeVisible();
  await page.getByRole('button', { name: 'Use learned rates' }).click();
  await expect(page.getByRole('textbox', { name: 'Show rate' })).toHaveValue(/^\d+\.\d%$/);
  await shot(page, 'planner-learned-rates');
});

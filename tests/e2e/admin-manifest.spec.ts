// Manifest import as its own step-by-step screen: the template carries the schema's columns, and a file with a bad
// line is previewed with that line, its column and the rule, before anything is stored.
import { expect, test } from '@playwright/test';
import { MANIFEST_COLUMNS } from '@shared/schemas/manifest';
import { shot, signIn } from './helpers';
import { expectNoAxeViolations, GATE_TERMINAL } from './admin-helpers';

test.use({ viewport: GATE_TERMINAL });

test('an admin downloads the template and sees a bad line named before importing', async ({ page }) => {
  await signIn(page, 'admin@bumpboard.test');
  await page.goto('/manifest?station=YUL');
  await expect(page).toHaveTitle('Manifest import · YUL · Bumpboard');
  await expect(page.getByRole('list', { name: 'Steps' }).getByRole('listitem')).toHaveCount(4);
  const href = await page.getByRole('link', { name: 'Download template' }).getAttribute('href');
  const template = await (await page.request.get(href ?? '')).text();
  const header = template.replace(/^\uFEFF/, '').split(/\r?\n/)[0].split(',');
  expect(header).toEqual(expect.arrayContaining([...MANIFEST_COLUMNS]));
  // The template's first passenger with a fare that is not in minor units.
  const lines = template.replace(/^\uFEFF/, '').trim().split(/\r?\n/);
  const fare = header.indexOf('fare_minor');
  const bad = lines[1].split(',');
  bad[fare] = '189.50';
  await page.getByLabel(/Manifest file/).setInputFiles({ name: 'manifest.csv', mimeType: 'text/csv', buffer: Buffer.from([lines[0], bad.join(','), ...lines.slice(2)].join('\r\n')) });
  await expect(page.getByText('fare_minor must be whole minor units')).toBeVisible();
  await expect(page.getByRole('button', { name: /^Import/ })).toHaveCount(0);
  await expectNoAxeViolations(page);
  await shot(page, 'admin-manifest-1366');
});

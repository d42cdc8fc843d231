// The admin edits a station's limits: a value out of range first (named with its field and rule), then a good one;
// the station is put back as it was found.
import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';
import { expectNoAxeViolations, GATE_TERMINAL, sql } from './admin-helpers';

test.use({ viewport: GATE_TERMINAL });

let before: { departure_grace_minutes: number };
test.beforeAll(async () => {
  [before] = await sql<{ departure_grace_minutes: number }>("SELECT departure_grace_minutes FROM stations WHERE iata = 'YUL'");
});
test.afterAll(async () => {
  await sql("UPDATE stations SET departure_grace_minutes = ? WHERE iata = 'YUL'", [before.departure_grace_minutes]);
});

test('an admin changes a station limit, after a rule names the bad value', async ({ page }) => {
  await signIn(page, 'admin@bumpboard.test');
  await page.goto('/stations');
  await expect(page).toHaveTitle('Stations · Bumpboard');
  await expect(page.getByText('Only a carrier-wide admin opens a new station')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Open a station' })).toHaveCount(0);
  await page.getByRole('button', { name: 'Edit YUL' }).click();
  const form = page.getByRole('form', { name: /Edit YUL/ });
  await form.getByLabel('Departure grace (minutes)').fill('500');
  await form.getByRole('button', { name: 'Save station' }).click();
  await expect(form.getByRole('alert')).toContainText('Departure grace: departureGraceMinutes must be at most 180');
  await expect(form.getByRole('alert')).toBeFocused();
  await shot(page, 'admin-stations-error-1366');
  await form.getByLabel('Departure grace (minutes)').fill('20');
  await form.getByRole('button', { name: 'Save station' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Saved YUL' })).toBeFocused();
  await expect(page.getByRole('row', { name: /YUL/ })).toContainText('20 min');
  await expectNoAxeViolations(page);
  await shot(page, 'admin-stations-1366');
});

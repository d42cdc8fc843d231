import { expect, test } from '@playwright/test';
import { expectNoAxeViolations, shot, signIn } from './helpers';

// A refused filter on the ledger: kept as typed, announced in the shared error summary, which Enter focuses and
// whose link takes the keyboard back to the field.
test('the ledger names a refused date filter in the error summary, which Enter focuses', async ({ page }) => {
  await page.setViewportSize({ width: 1366, height: 768 });
  await signIn(page, 'finance@bumpboard.test');
  await page.goto('/ledger');
  await expect(page.getByRole('heading', { level: 1, name: 'Compensation ledger' })).toBeFocused();
  const filters = page.getByRole('search', { name: 'Filter the ledger' });
  await filters.getByLabel('Flights from').fill('2026-12-05');
  const to = filters.getByLabel('Flights to');
  await to.fill('2026-12-01');
  const summary = filters.getByRole('alert');
  await expect(summary).toContainText('Flights to: must not be before “Flights from”');
  await expect(to).toHaveValue('2026-12-01');
  await to.press('Enter');
  await expect(summary).toBeFocused();
  await expectNoAxeViolations(page, 'the ledger with a refused filter');
  await shot(page, 'form-summary-ledger-filter');
  await summary.getByRole('link', { name: 'Flights to' }).click();
  await expect(to).toBeFocused();
});

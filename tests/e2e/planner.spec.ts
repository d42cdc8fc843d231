import { expect, test, type Page } from '@playwright/test';
import { SCREENSHOTS, shot, signIn } from './helpers';

// Team 180, "Optimal Overbooking", MCM 2002 (The UMAP Journal 23(3), 2002), Table 1: 150 seats, show probability
// 0.90, a bumped passenger costs (k + 1) times the fare: k = 1 (cost 2 x fare) -> 167 bookings, k = 2 -> 165.
const planName = `Weekday fare x2 ${Date.now().toString(36)}`;
// a future flight of this run alone, so its list holds only what this run saved
const designator = `BB${String(Date.now() % 10_000).padStart(4, '0')}`;
const flightKey = `BOS-ORD/${designator}/2031-06-01`;

async function openPlanner(page: Page) {
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Planner' }).click();
  await expect(page.getByRole('heading', { level: 1, name: /^Planner · / })).toBeVisible();
}

const result = (page: Page) => page.getByRole('region', { name: 'Result' });

async function chooseFlight(page: Page) {
  await page.getByRole('radio', { name: 'A future flight' }).check();
  await page.getByLabel('To (IATA code)').fill('ORD');
  await page.getByRole('textbox', { name: 'Flight' }).fill(designator);
  await page.getByLabel('Departure date (local)').fill('2031-06-01');
}

async function typeFigures(page: Page, cost: string) {
  await page.getByRole('textbox', { name: 'Seats' }).fill('150');
  await page.getByRole('textbox', { name: 'Show rate' }).fill('0.9');
  await page.getByLabel(/^Revenue per booking/).fill('200.00');
  await page.getByLabel(/^Cost per denied boarding/).fill(cost);
}

test.describe.configure({ mode: 'serial' });

test('a supervisor finds the best booking limit for a future flight, checks a field rule, builds the cost and saves a plan', async ({ page }) => {
  await signIn(page, 'supervisor@bumpboard.test');
  await openPlanner(page);
  await expect(page.getByRole('note')).toContainText('These figures are a model');
  await shot(page, 'planner-empty');

  await chooseFlight(page);
  await typeFigures(page, '400.00');
  await expect(result(page).getByText(/^Best: 167 bookings, expected net \$/)).toBeVisible();
  const table = result(page).getByRole('table', { name: /Expected net revenue and oversale risk by bookings accepted: 150 seats/ });
  await expect(table.getByRole('row', { name: /^167 Best/ })).toBeVisible();
  await expect(result(page).getByText('Best: 167', { exact: true })).toBeVisible(); // the reference line's label on the chart
  await shot(page, 'planner-curve');
  await result(page).screenshot({ path: `${SCREENSHOTS}/planner-result.png` });

  // a rule broken while typing: the message names the rule beside the field and the typed text stays
  const showRate = page.getByRole('textbox', { name: 'Show rate' });
  await showRate.fill('1.5');
  await showRate.blur();
  await expect(page.getByText('Show rate must be at most 1')).toBeVisible();
  await expect(showRate).toHaveValue('1.5');
  await expect(showRate).toHaveAttribute('aria-invalid', 'true');
  await expect(result(page).getByText(/^These are the figures of your last valid entry/)).toBeVisible();
  await shot(page, 'planner-field-error');
  await showRate.fill('0.9');
  await expect(page.getByText('Show rate must be at most 1')).toHaveCount(0);

  // cost 3 x fare (k = 2 in Team 180's Table 1)
  await page.getByLabel(/^Cost per denied boarding/).fill('600.00');
  await expect(result(page).getByText(/^Best: 165 bookings/)).toBeVisible();

  // cost helper: 14 CFR 250.5(a)(3), more than 2 h late on a domestic flight -> 400 % of the 200.00 fare = USD 800.00
  await page.getByText('Work out this cost from the compensation rules').click();
  await expect(page.getByText('Compensation: $800.00')).toBeVisible();
  await page.getByLabel(/^Rebooking cost/).fill('150');
  await page.getByLabel(/^Goodwill/).fill('50');
  await expect(page.getByText('Total per denied boarding:')).toContainText('$1,000.00');
  await shot(page, 'planner-cost-helper');
  await page.getByRole('button', { name: 'Use this cost' }).click();
  await expect(page.getByLabel(/^Cost per denied boarding/)).toHaveValue('1000.00');

  await page.getByLabel(/^Cost per denied boarding/).fill('400.00');
  await expect(result(page).getByText(/^Best: 167 bookings/)).toBeVisible();
  await page.getByLabel('Plan name').fill(planName);
  await page.getByRole('button', { name: `Save plan for ${flightKey}` }).click();
  await expect(page.getByRole('status').filter({ hasText: `Saved “${planName}”.` })).toBeVisible();
  const saved = page.getByRole('list', { name: `Saved plans for ${flightKey}` }).getByRole('listitem').filter({ hasText: planName });
  await expect(saved).toContainText('Best: 167 bookings');
  await expect(saved).toContainText(/Saved by .+, /);
  await shot(page, 'planner-saved');
});

test('an admin sees the plan the supervisor saved and reopens its figures', async ({ page }) => {
  await signIn(page, 'admin@bumpboard.test');
  await openPlanner(page);
  await chooseFlight(page);
  const saved = page.getByRole('list', { name: `Saved plans for ${flightKey}` }).getByRole('listitem');
  await expect(saved).toHaveCount(1);
  await expect(saved).toContainText(planName);
  await page.getByRole('textbox', { name: 'Seats' }).fill('200');
  await saved.getByRole('button', { name: `Open plan ${planName}` }).click();
  await expect(page.getByRole('textbox', { name: 'Flight' })).toHaveValue(designator);
  await expect(page.getByRole('textbox', { name: 'Seats' })).toHaveValue('150');
  await expect(page.getByLabel(/^Cost per denied boarding/)).toHaveValue('400.00');
  await expect(result(page).getByText(/^Best: 167 bookings/)).toBeVisible();
  await shot(page, 'planner-admin-reopened');
});

test('at an EU 261 station the cost helper pays by distance band, in euros', async ({ page }) => {
  await signIn(page, 'supervisor@bumpboard.test');
  const station = page.getByRole('combobox', { name: 'Station' });
  const fco = await station.locator('option', { hasText: 'FCO' }).textContent();
  await station.selectOption({ label: fco ?? 'FCO' });
  await openPlanner(page);
  await expect(page.getByRole('heading', { level: 1, name: 'Planner · FCO' })).toBeVisible();
  await expect(page.getByLabel(/^Revenue per booking/)).toHaveAccessibleName('Revenue per booking (EUR)');
  await page.getByText('Work out this cost from the compensation rules').click();
  await page.getByLabel('Distance to the destination (km)').fill('1000');
  // Reg. (EC) 261/2004 Art. 7(1)(a): EUR 250 for flights of 1,500 km or less
  await expect(page.getByText('Compensation: €250.00')).toBeVisible();
  await page.getByLabel('Distance to the destination (km)').fill('');
  await expect(page.getByText(/^Distance: required for eu-261/)).toBeVisible();
  await page.getByLabel('Distance to the destination (km)').fill('1000');
  await shot(page, 'planner-fco-cost-helper');
});

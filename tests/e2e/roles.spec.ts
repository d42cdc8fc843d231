import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';

test('the sign-in page names the product and refuses a wrong password without saying which part was wrong', async ({ page }) => {
  await page.goto('/');
  await expect(page).toHaveTitle(/Bumpboard/);
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await shot(page, 'sign-in');
  await page.getByLabel('E-mail').fill('agent@bumpboard.test');
  await page.getByLabel('Password').fill('not the password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert')).toHaveText('That e-mail and password do not match an active account.');
  await shot(page, 'sign-in-failed');
});

const homes = [
  { email: 'agent@bumpboard.test', path: '/departures', heading: /Departures · / },
  { email: 'supervisor@bumpboard.test', path: '/day', heading: /Station day · / },
  { email: 'finance@bumpboard.test', path: '/ledger', heading: 'Compensation ledger' },
  { email: 'admin@bumpboard.test', path: '/setup', heading: 'Station setup' },
];

for (const home of homes) {
  test(`${home.email} lands on their own home`, async ({ page }) => {
    await signIn(page, home.email);
    await expect(page).toHaveURL(new RegExp(`${home.path}(\\?station=[A-Z]{3})?$`));
    await expect(page.getByRole('heading', { level: 1, name: home.heading })).toBeVisible();
    await shot(page, `home-${home.email.split('@')[0]}`);
  });
}

test('an agent sees the departures of their station with counts, and only the navigation of their role', async ({ page }) => {
  await signIn(page, 'agent@bumpboard.test');
  const table = page.getByRole('table');
  await expect(table.getByRole('link').first()).toBeVisible();
  await expect(page.getByRole('navigation', { name: 'Main' }).getByRole('link')).toHaveText(['Departures']);
});

test('a page opened without a session returns there after sign-in', async ({ page }) => {
  await page.goto('/planner');
  await expect(page).toHaveURL(/sign-in\?next=%2Fplanner/);
  await page.getByLabel('E-mail').fill('supervisor@bumpboard.test');
  await page.getByLabel('Password').fill('bumpboard-demo-2026');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/planner(\?station=[A-Z]{3})?$/);
});

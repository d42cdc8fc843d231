// The admin adds a flight by hand (a wrong airport first, named with its field), cancels it with a reason, and sets
// up a weekly schedule that generates its dated flights. Everything made here is removed afterwards.
import { expect, test } from '@playwright/test';
import { shot, signIn } from './helpers';
import { daysAhead, expectNoAxeViolations, freshNumber, GATE_TERMINAL, sql } from './admin-helpers';

const FLIGHT = freshNumber('E');
const SCHEDULE = freshNumber('W');

test.use({ viewport: GATE_TERMINAL });

test.afterAll(async () => {
  await sql("DELETE FROM flights WHERE carrier_code = 'ZZ' AND flight_number IN (?, ?)", [FLIGHT, SCHEDULE]);
  await sql("DELETE FROM flight_schedules WHERE carrier_code = 'ZZ' AND flight_number = ?", [SCHEDULE]);
});

test('an admin adds a flight, fixes a wrong airport, and cancels it with a reason', async ({ page }) => {
  await signIn(page, 'admin@bumpboard.test');
  await page.goto('/flights?station=BOS');
  await expect(page.getByRole('heading', { level: 1, name: 'Flights · BOS' })).toBeVisible();
  await expect(page).toHaveTitle('Flights · BOS · Bumpboard');
  await page.getByRole('button', { name: 'Add a flight' }).click();
  const form = page.getByRole('form', { name: 'Add a flight from BOS' });
  await form.getByLabel('Flight number').fill(FLIGHT);
  await form.getByLabel('Date').fill(daysAhead(3));
  await form.getByLabel('To').fill('XXQ');
  await form.getByLabel('Departs').fill('08:15');
  await form.getByLabel('Block time (minutes)').fill('150');
  await form.getByLabel('Seats per cabin').fill('J 12, Y 138');
  await form.getByRole('button', { name: 'Add flight' }).click();
  const problems = form.getByRole('alert');
  await expect(problems).toContainText('To: XXQ is not an airport in the reference airport data');
  await expect(problems).toBeFocused();
  await shot(page, 'admin-flights-error-1366');
  await form.getByLabel('To').fill('ORD');
  await form.getByRole('button', { name: 'Add flight' }).click();
  const result = page.getByRole('status').filter({ hasText: `Added ZZ${FLIGHT}` });
  await expect(result).toBeFocused();
  await expect(page.getByRole('row', { name: new RegExp(`ZZ${FLIGHT}`) })).toContainText('08:15');
  await expectNoAxeViolations(page);
  await shot(page, 'admin-flights-1366');

  await page.getByRole('button', { name: `Cancel ZZ${FLIGHT} on ${daysAhead(3)}` }).click();
  await page.getByLabel('Reason').fill('Aircraft swapped to another rotation');
  await page.getByRole('button', { name: `Cancel ZZ${FLIGHT}`, exact: true }).click();
  await expect(page.getByRole('status').filter({ hasText: `Cancelled ZZ${FLIGHT}` })).toBeFocused();
  await expect(page.getByRole('row', { name: new RegExp(`ZZ${FLIGHT}`) })).toContainText('Cancelled');
  const [audit] = await sql<{ after: string }>("SELECT `after` FROM audit_log WHERE action = 'flight.cancelled' ORDER BY id DESC LIMIT 1");
  expect(JSON.stringify(audit.after)).toContain('Aircraft swapped');
});

test('an admin sets up a weekly schedule and sees the flights it made', async ({ page }) => {
  await signIn(page, 'admin@bumpboard.test');
  await page.goto('/schedules?station=BOS');
  await expect(page).toHaveTitle('Weekly schedules · BOS · Bumpboard');
  await page.getByRole('button', { name: 'New weekly schedule' }).click();
  const form = page.getByRole('form', { name: 'New weekly schedule from BOS' });
  await form.getByLabel('Flight number').fill(SCHEDULE);
  await form.getByLabel('To').fill('ORD');
  await form.getByLabel('Departs').fill('09:00');
  await form.getByLabel('Block time (minutes)').fill('160');
  await form.getByLabel('Seats per cabin').fill('Y 150');
  await form.getByLabel('First day').fill(daysAhead(20));
  await form.getByLabel('Last day').fill(daysAhead(33));
  // No weekday ticked: the server names the field.
  await form.getByRole('button', { name: 'Create and add its flights' }).click();
  await expect(form.getByRole('alert')).toContainText('Days: weekdays must name at least one day');
  await form.getByLabel('Mon').check();
  await form.getByLabel('Thu').check();
  await form.getByRole('button', { name: 'Create and add its flights' }).click();
  // Two weeks hold two Mondays and two Thursdays.
  await expect(page.getByRole('status').filter({ hasText: `Created ZZ${SCHEDULE} BOS–ORD: 4 flights added` })).toBeFocused();
  await expect(page.getByRole('row', { name: new RegExp(`ZZ${SCHEDULE}`) })).toContainText('Mon Thu');
  await expectNoAxeViolations(page);
  await shot(page, 'admin-schedules-1366');
  const rows = await sql<{ n: number }>("SELECT COUNT(*) AS n FROM flights WHERE flight_number = ? AND state = 'scheduled'", [SCHEDULE]);
  expect(Number(rows[0].n)).toBe(4);
});

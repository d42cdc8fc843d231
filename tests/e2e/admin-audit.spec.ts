// The audit viewer: a bad filter named with its field, a flight's rows found by the flight, and the CSV of the filter.
import { expect, test } from '@playwright/test';
import { shot, signIn, staffApi } from './helpers';
import { daysAhead, expectNoAxeViolations, freshNumber, GATE_TERMINAL, sql } from './admin-helpers';

test.use({ viewport: GATE_TERMINAL });
const NUMBER = freshNumber('L');
let flightId = 0;

test.beforeAll(async () => {
  const [{ id }] = await sql<{ id: number }>("SELECT id FROM stations WHERE iata = 'YUL'");
  const admin = await staffApi('admin@bumpboard.test');
  const made = await admin.post(`/stations/${id}/flights`, { carrierCode: 'ZZ', flightNumber: NUMBER, serviceDate: daysAhead(9), departureTime: '07:40', blockMinutes: 95, destination: 'YYZ', seatsByCabin: { Y: 120 } });
  expect(made.status).toBe(201);
  flightId = (made.body as { id: number }).id;
  expect((await admin.post(`/flights/${flightId}/cancel`, { reason: 'Audit viewer check' })).status).toBe(200);
  await admin.dispose();
});
test.afterAll(async () => {
  await sql("DELETE FROM flights WHERE carrier_code = 'ZZ' AND flight_number = ?", [NUMBER]);
});

test('an admin finds a flight’s history and exports it', async ({ page }) => {
  await signIn(page, 'admin@bumpboard.test');
  await page.goto('/audit?station=YUL');
  await expect(page).toHaveTitle('Audit log · YUL · Bumpboard');
  await page.getByLabel('Flight id').fill('abc');
  await page.getByRole('button', { name: 'Show' }).click();
  await expect(page.getByRole('alert')).toContainText('flightId: flightId must be a number');
  await page.getByLabel('Flight id').fill(String(flightId));
  await page.getByRole('button', { name: 'Show' }).click();
  const rows = page.getByRole('row').filter({ hasText: 'admin@bumpboard.test' });
  await expect(rows).toHaveCount(2);
  await expect(rows.first()).toContainText('flight.cancelled');
  await expect(rows.first()).toContainText('Audit viewer check');
  await expectNoAxeViolations(page);
  await shot(page, 'admin-audit-1366');
  const href = await page.getByRole('link', { name: 'CSV' }).getAttribute('href');
  const csv = await (await page.request.get(href ?? '')).text();
  expect(csv.split('\r\n')[0]).toBe('id,at_utc,actor,action,entity_type,entity_id,before,after');
  expect(csv.split('\r\n').filter((l) => l.includes('flight.'))).toHaveLength(2);
});

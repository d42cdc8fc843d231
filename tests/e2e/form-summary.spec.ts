import { expect, test } from '@playwright/test';
import { expectNoAxeViolations, shot, signIn, staffApi } from './helpers';
import { sql } from './admin-helpers';

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

// On the desk: a round asked for no volunteers is refused before anything is sent, and the summary takes focus.
test('the desk’s open-round form names a refused field in the error summary, which takes focus', async ({ page }) => {
  await page.setViewportSize({ width: 1366, height: 768 });
  const agent = await staffApi('agent@bumpboard.test');
  try {
    const [flight] = await sql<{ id: number }>(
      "SELECT f.id FROM flights f JOIN stations s ON s.id = f.station_id WHERE s.iata = 'BOS' AND f.carrier_code = 'ZZ' AND f.flight_number = '105' ORDER BY f.scheduled_departure DESC LIMIT 1",
    );
    const rounds = (await (await agent.api.get(`/api/flights/${flight.id}/rounds`)).json()) as { rounds: { id: number; status: string }[] };
    for (const r of rounds.rounds.filter((x) => x.status === 'open')) expect((await agent.post(`/rounds/${r.id}/close`)).status).toBe(200);
    await signIn(page, 'agent@bumpboard.test');
    await page.goto(`/flights/${flight.id}`);
    const form = page.getByRole('form', { name: 'Open a volunteer round' });
    await form.getByLabel('Volunteers needed').fill('0');
    await form.getByRole('button', { name: /^Open a volunteer round at / }).click();
    const summary = form.getByRole('alert');
    await expect(summary).toBeFocused();
    await expect(summary).toContainText('Volunteers needed: must be a whole number from 1 to 60');
    await expectNoAxeViolations(page, 'the desk with a refused open-round form');
    await summary.screenshot({ path: 'test-results/screenshots/form-summary-open-round.png' });
    await summary.getByRole('link', { name: 'Volunteers needed' }).click();
    await expect(form.getByLabel('Volunteers needed')).toBeFocused();
  } finally {
    await agent.dispose();
  }
});

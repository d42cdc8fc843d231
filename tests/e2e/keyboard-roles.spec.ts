// Each role's main path with the keyboard alone (Tab, typing, Enter, Space, Esc), at the gate terminal's size: after
// every action focus is on the result message, the new screen's heading or the next control, never the page body.
// The scenes (an amount above the agent's limit, a denial proposal, a flight of our own) are set through the API on
// flights this spec makes and removes.
import { expect, test } from '@playwright/test';
import mysql from 'mysql2/promise';
import { MANIFEST_COLUMNS } from '@shared/schemas/manifest';
import { removeTestFlights, staffApi, type Staff } from './helpers';
import { ownFlight, type OwnFlight } from './own-flight';
import { activate, expectArrival, expectFocusKept, GATE_TERMINAL, keyboardSignIn, tabBackTo, typeInto } from './keyboard-helpers';
import { daysAhead, freshNumber, sql } from './admin-helpers';

test.use({ viewport: GATE_TERMINAL });
test.setTimeout(180_000);

/** As the client writes amounts: en-US currency of minor units. */
const moneyText = (minor: number, currency: string) => new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(minor / 100);

interface Rounds { rounds: { id: number; status: string }[]; policy: { currency: string; ladderMinor: number[]; agentLimitMinor: number } }

async function closeOpenRounds(staff: Staff, flightId: number): Promise<Rounds> {
  const rounds: Rounds = await (await staff.api.get(`/api/flights/${flightId}/rounds`)).json();
  for (const r of rounds.rounds.filter((x) => x.status === 'open')) await staff.post(`/rounds/${r.id}/close`);
  return rounds;
}

test.describe('supervisor', () => {
  let flight: OwnFlight;
  test.beforeAll(async () => {
    flight = await ownFlight('kbsup');
  });
  test.afterAll(async () => {
    await flight?.remove();
  });

  test('approves an amount above the agent’s limit and authorizes a denial without a mouse', async ({ page }) => {
    const agent = await staffApi('agent@bumpboard.test');
    try {
      const { policy } = await closeOpenRounds(agent, flight.flightId);
      const above = policy.ladderMinor.find((step) => step > policy.agentLimitMinor);
      expect(above, 'the station’s ladder has a step above the agent limit').toBeDefined();
      const opened = await agent.post(`/flights/${flight.flightId}/rounds`, { kind: 'posted', offerMinor: policy.agentLimitMinor, extras: [], volunteersNeeded: 2 });
      expect(opened.status).toBe(201);
      const raised = await agent.post(`/rounds/${(opened.body as { id: number }).id}/raise`, { offerMinor: above });
      expect(raised.body).toMatchObject({ approvalRequested: true });

      await keyboardSignIn(page, 'supervisor@bumpboard.test', /^Station day · /);
      await page.goto('/day?station=BOS');
      await expectArrival(page, 'Station day · BOS');
      const row = page.getByTestId('approval-row').filter({ hasText: flight.label });
      await activate(page, row.getByRole('button', { name: `Approve ${moneyText(above!, policy.currency)}` }));
      // The row leaves the queue; the words of what happened take its place and the focus.
      await expect(page.getByRole('status').filter({ hasText: `Approved ${moneyText(above!, policy.currency)} for ${flight.label}` })).toBeFocused();

      await closeOpenRounds(agent, flight.flightId);
      const proposed = await agent.post(`/flights/${flight.flightId}/denial-proposals`, { seatsNeeded: 1, reason: 'keyboard path: one short at the gate' });
      expect(proposed.status).toBe(201);
      const waiting = page.getByRole('list', { name: 'Denied-boarding proposals waiting' }).getByRole('listitem').filter({ hasText: flight.label });
      await expect(waiting).toBeVisible({ timeout: 15_000 });
      await activate(page, waiting.getByRole('link', { name: /Open bump review/ }));
      await expectArrival(page, new RegExp(`^Bump review · ${flight.label}`));
      await activate(page, page.getByRole('button', { name: 'Authorize all (1)' }), 'Space');
      await expect(page.getByRole('status').filter({ hasText: /^Authorized 1 denial/ })).toBeFocused();
      await expect(page.locator('[data-proposal-status="authorized"]')).toBeVisible();
    } finally {
      await closeOpenRounds(agent, flight.flightId);
      await agent.dispose();
    }
  });
});

test('finance reconciles and exports the ledger as CSV without a mouse', async ({ page }) => {
  await keyboardSignIn(page, 'finance@bumpboard.test', 'Compensation ledger');
  const [download] = await Promise.all([page.waitForEvent('download'), activate(page, page.getByRole('link', { name: 'Export CSV of these rows' }))]);
  expect(download.suggestedFilename()).toMatch(/\.csv$/);
  // A download leaves focus on the link that started it.
  await expect(page.getByRole('link', { name: 'Export CSV of these rows' })).toBeFocused();

  const reconciliation = page.getByRole('navigation').getByRole('link', { name: 'Reconciliation' });
  await tabBackTo(page, reconciliation);
  await page.keyboard.press('Enter');
  await expectArrival(page, 'Reconciliation');
  await activate(page, page.getByRole('button', { name: 'Start reconciliation' }));
  // The run's own line takes focus while the run goes on; its outcome is the reconciliation's business, not this path's.
  const status = page.getByTestId('run-status');
  await expect(status).toBeFocused();
  await expect(status).toContainText(/Completed|Failed|Interrupted/, { timeout: 60_000 });
  await expectFocusKept(page, 'the run finished');
});

test.describe('admin', () => {
  const number = freshNumber('K');
  const date = daysAhead(290);
  test.afterAll(async () => {
    const ids = await sql<{ id: number }>("SELECT id FROM flights WHERE carrier_code = 'ZZ' AND flight_number = ?", [number]);
    const db = await mysql.createConnection({ uri: (process.env.DATABASE_URL ?? '').replace(/^mariadb:/, 'mysql:'), timezone: 'Z' });
    try {
      await removeTestFlights(db, ids.map((r) => Number(r.id)));
    } finally {
      await db.end();
    }
  });

  test('adds a flight and imports its manifest without a mouse', async ({ page }) => {
    await keyboardSignIn(page, 'admin@bumpboard.test', 'Station setup');
    await page.goto('/flights?station=BOS');
    await expectArrival(page, 'Flights · BOS');
    await activate(page, page.getByRole('button', { name: 'Add a flight' }));
    const form = page.getByRole('form', { name: 'Add a flight from BOS' });
    await expect(form).toBeVisible();
    await typeInto(page, form.getByLabel('Flight number'), number);
    // Date fields take their digits segment by segment, in the browser's order (en-US: month, day, year).
    const [y, m, d] = date.split('-');
    await typeInto(page, form.getByLabel('Date'), `${m}${d}${y}`);
    await typeInto(page, form.getByLabel('To'), 'ORD');
    await typeInto(page, form.getByLabel('Departs'), '0815AM');
    await typeInto(page, form.getByLabel('Block time (minutes)'), '150');
    await typeInto(page, form.getByLabel('Seats per cabin'), 'Y 150');
    await page.keyboard.press('Enter');
    await expect(page.getByRole('status').filter({ hasText: `Added ZZ${number}` })).toBeFocused();
    // Far beyond the list's fortnight, so the flight is checked where it was stored.
    const [stored] = await sql<{ service_date: string }>("SELECT DATE_FORMAT(service_date, '%Y-%m-%d') AS service_date FROM flights WHERE carrier_code = 'ZZ' AND flight_number = ?", [number]);
    expect(stored?.service_date).toBe(date);

    const manifest = page.getByRole('navigation').getByRole('link', { name: 'Manifest import' });
    await tabBackTo(page, manifest);
    await page.keyboard.press('Enter');
    await expectArrival(page, 'Manifest import · BOS');
    const input = page.getByLabel(/Manifest file/);
    const passenger = (pnr: string, first: string, last: string, fare: number): Record<string, string> => ({
      flight_carrier: 'ZZ', flight_number: number, flight_date: date, pnr, sequence: '1', first_name: first, last_name: last, cabin: 'Y',
      fare_minor: String(fare), fare_currency: 'USD', fare_type: 'standard', is_child: 'false', contact_email: `kb-${pnr.toLowerCase()}@passengers.bumpboard.test`,
    });
    const rows = [passenger(`KB${number.slice(0, 4)}`, 'Noor', 'Keyfield', 21900), passenger(`KC${number.slice(0, 4)}`, 'Ilse', 'Tabbing', 18900)];
    const csv = [MANIFEST_COLUMNS.join(','), ...rows.map((r) => MANIFEST_COLUMNS.map((c) => r[c] ?? '').join(','))].join('\r\n');
    // Space on the file field opens the system's picker (outside the page); the test answers it.
    const [chooser] = await Promise.all([page.waitForEvent('filechooser'), activate(page, input, 'Space')]);
    await chooser.setFiles({ name: 'manifest.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await expect(page.getByRole('status').filter({ hasText: '2 passenger rows read' })).toContainText('no problems found');
    await activate(page, page.getByRole('button', { name: 'Import 2 passengers' }));
    await expect(page.getByRole('status', { name: 'Import result' })).toBeFocused();
    await expect(page.getByRole('status', { name: 'Import result' })).toContainText('Imported 2 passenger rows for 1 flight');
  });
});

// Finance sees an issued compensation in the ledger (with the card's state at the payment provider), exports the
// filtered rows as CSV, and runs a reconciliation that comes out clean. Then finance voids the payment: the
// passenger stays owed, an alert reaches finance and the station, and the desk re-issues it.
// Needs: the app at APP_BASE_URL talking to the payments stand-in (STRIPE_API_URL), and DATABASE_URL of the same
// database: the test writes its own flight on a far-off date with one volunteer's compensation, which an agent
// issues through the API. It works at a station of its own (Hartford, BDL), which the demo finance user and agent
// belong to only while it runs: a reconciliation of that station reads nothing another spec left at the provider or
// in the ledger. At the end finance voids it, so the card can never be spent and both sides still agree.
import { readFile } from 'node:fs/promises';
import { expect, request, test, type APIRequestContext } from '@playwright/test';
import mysql from 'mysql2/promise';
import Papa from 'papaparse';
import { DEMO_PASSWORD, mailFromCatcher, shot, signIn } from './helpers';

const BASE_URL = process.env.APP_BASE_URL ?? 'http://127.0.0.1:4700';
const DATABASE_URL = process.env.DATABASE_URL ?? '';
const RUN = Date.now() % 1_000_000;
const SERVICE_DATE = `2033-0${1 + (RUN % 9)}-${String(10 + (RUN % 18)).padStart(2, '0')}`;

let db: mysql.Connection;
let compensationId: number;
let flightLabel: string;
let flightId: number;
let stationId: number;
let linkedUserIds: number[] = [];
const STATION = 'BDL';
const PEOPLE = ['finance@bumpboard.test', 'agent@bumpboard.test'];

async function staff(email: string): Promise<{ api: APIRequestContext; csrf: string }> {
  const api = await request.newContext({ baseURL: BASE_URL });
  const session = await (await api.get('/api/auth/session')).json();
  const res = await api.post('/api/auth/sign-in', { headers: { 'X-CSRF-Token': session.csrfToken }, data: { email, password: DEMO_PASSWORD } });
  expect(res.ok()).toBe(true);
  return { api, csrf: (await res.json()).csrfToken };
}

test.beforeAll(async () => {
  test.skip(!DATABASE_URL, 'DATABASE_URL is needed to make the test flight');
  db = await mysql.createConnection(DATABASE_URL.replace(/^mariadb:/, 'mysql:'));
  await db.execute(`INSERT IGNORE INTO stations (iata, name, time_zone, regime, currency) VALUES (?, 'Hartford (finance end-to-end station)', 'America/New_York', 'us-dot', 'USD')`, [STATION]);
  const [[station]] = await db.query<mysql.RowDataPacket[]>('SELECT id FROM stations WHERE iata = ?', [STATION]);
  stationId = station.id;
  const [people] = await db.query<mysql.RowDataPacket[]>('SELECT u.id FROM users u WHERE u.email IN (?) AND NOT EXISTS (SELECT 1 FROM user_stations us WHERE us.user_id = u.id AND us.station_id = ?)', [PEOPLE, stationId]);
  linkedUserIds = people.map((p) => Number(p.id));
  for (const id of linkedUserIds) await db.execute('INSERT INTO user_stations (user_id, station_id) VALUES (?, ?)', [id, stationId]);
  const number = String(7000 + (RUN % 1000));
  flightLabel = `ZZ ${number}`;
  const departure = new Date(`${SERVICE_DATE}T14:00:00Z`);
  const [flight] = await db.execute<mysql.ResultSetHeader>(
    `INSERT INTO flights (station_id, carrier_code, flight_number, service_date, origin, destination, scheduled_departure, scheduled_arrival, aircraft_type, seats_by_cabin, gate, state)
     VALUES (?, 'ZZ', ?, ?, ?, 'ORD', ?, ?, '320', '{"Y":150}', 'B4', 'departed')`,
    [stationId, number, SERVICE_DATE, STATION, departure, new Date(departure.getTime() + 3 * 3_600_000)],
  );
  const [booking] = await db.execute<mysql.ResultSetHeader>(`INSERT INTO bookings (flight_id, pnr, contact_email, travels_together, status) VALUES (?, ?, ?, 1, 'active')`, [flight.insertId, `F${RUN}`.slice(0, 8), `finance-e2e-${RUN}@example.test`]);
  const [passenger] = await db.execute<mysql.ResultSetHeader>(
    `INSERT INTO passengers (booking_id, flight_id, pnr_sequence, first_name, last_name, cabin, fare_minor, fare_currency, fare_type, ssr_codes, is_child, status)
     VALUES (?, ?, 1, 'Marta', 'Ledgerwood', 'Y', 31000, 'USD', 'standard', '[]', 0, 'boarded')`,
    [booking.insertId, flight.insertId],
  );
  const [comp] = await db.execute<mysql.ResultSetHeader>(
    `INSERT INTO compensations (station_id, flight_id, booking_id, passenger_id, source_kind, source_id, regime, voluntary, amount_minor, currency, band, rule_ref, explanation, state)
     VALUES (?, ?, ?, ?, 'volunteer', ?, 'us-dot', 1, 45000, 'USD', 'posted offer', 'agreed with the volunteer', 'Volunteered (end-to-end test).', 'due')`,
    [stationId, flight.insertId, booking.insertId, passenger.insertId, 1_900_000_000 + RUN],
  );
  compensationId = comp.insertId;
  flightId = flight.insertId;

  // The agent issues it at the desk's API: a prepaid card at the payment provider.
  const agent = await staff('agent@bumpboard.test');
  const issued = await agent.api.post(`/api/compensations/${compensationId}/issue`, { headers: { 'X-CSRF-Token': agent.csrf } });
  expect(issued.ok()).toBe(true);
  expect((await issued.json()).compensation.state).toBe('issued');
});

test.afterAll(async () => {
  if (!db) return;
  if (compensationId) {
    const finance = await staff('finance@bumpboard.test');
    await finance.api.post(`/api/compensations/${compensationId}/void`, { headers: { 'X-CSRF-Token': finance.csrf }, data: { reason: 'End-to-end test compensation' } });
    // The clean-up void raises an alert like any other; it is this test's own, so it goes with it.
    await db.execute('DELETE FROM alerts WHERE compensation_id = ?', [compensationId]);
  }
  // The station stays (its audit rows are kept); nobody belongs to it once the spec is done.
  if (linkedUserIds.length) await db.query('DELETE FROM user_stations WHERE station_id = ? AND user_id IN (?)', [stationId, linkedUserIds]);
  await db.end();
});

test('finance sees the issued compensation, exports exactly the filtered rows, and reconciles clean', async ({ page }) => {
  await signIn(page, 'finance@bumpboard.test');
  await page.getByRole('link', { name: 'Compensation ledger' }).click();
  await expect(page.getByRole('heading', { name: 'Compensation ledger' })).toBeVisible();
  await page.getByLabel('Flights from').fill(SERVICE_DATE);
  await page.getByLabel('Flights to').fill(SERVICE_DATE);
  const row = page.getByRole('row', { name: new RegExp(`^${STATION} ${flightLabel}.*Marta Ledgerwood`) });
  await expect(row).toBeVisible();
  await expect(row).toContainText(flightLabel);
  await expect(row).toContainText('$450.00');
  await expect(row).toContainText('Active card');
  await expect(row).toContainText('Issued');
  await expect(page.getByTestId('total-USD')).toContainText('$450.00');
  // The ledger's own caution; the care-costs panel below carries one of its own.
  await expect(page.getByRole('note').filter({ hasText: 'configured rules say' }).first()).toContainText('Caution');
  await shot(page, 'finance-ledger');

  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Export CSV of these rows' }).click()]);
  const csv = Papa.parse<Record<string, string>>(await readFile((await download.path())!, 'utf8'), { header: true, skipEmptyLines: true });
  expect(csv.data.map((r) => r.compensation_id)).toEqual([String(compensationId)]);
  expect(csv.data[0]).toMatchObject({ passenger: 'Marta Ledgerwood', amount: '450.00', currency: 'USD', ledger_state: 'issued', provider_status: 'active' });

  await page.getByRole('link', { name: 'Reconciliation' }).click();
  await page.getByLabel('Stations').selectOption(String(stationId));
  await page.getByRole('button', { name: 'Start reconciliation' }).click();
  await expect(page.getByTestId('run-status')).toContainText('Completed', { timeout: 30_000 });
  await expect(page.getByText('No differences: the ledger, the provider and the counter register agree.')).toBeVisible();
  // Each medium against its own record: the one card at the provider holds the $450.00 still to be spent.
  const cards = page.getByTestId('recon-medium-prepaid-card');
  await expect(cards).toContainText('cards at the provider');
  await expect(cards).toContainText('$450.00');
  await expect(cards).toContainText('none');
  await expect(page.getByTestId('recon-medium-bank-transfer')).toContainText('outbound payments');
  await expect(page.getByTestId('recon-medium-cash')).toContainText('drawers and the cheque register');
  await expect(page.getByTestId('recon-medium-travel-credit')).toContainText('travel credits');
  await shot(page, 'finance-reconciliation');

  await page.getByRole('link', { name: 'Period report' }).click();
  await expect(page.getByRole('heading', { name: 'Period report' })).toBeVisible();
  await expect(page.getByText(/Form 251: passengers denied confirmed space/)).toBeVisible();
  await expect(page.getByTestId('report-day-chart').or(page.getByText(/No compensation in/)).first()).toBeVisible();
  await shot(page, 'finance-report');
});

test('the passenger’s receipt for the issued compensation arrives in the mail catcher, once', async () => {
  const to = `finance-e2e-${RUN}@example.test`;
  const messages = await mailFromCatcher(`to=${encodeURIComponent(to)}`, (m) => (m.length ? m : undefined), `the receipt to ${to}`);
  expect(messages).toHaveLength(1);
  expect(messages[0].text).toContain('450.00');
});

test('a voided payment stays owed: finance and the station are alerted, and the desk re-issues it', async ({ browser }) => {
  // Two people, four screens and a card issued at the provider: more than the default minute on a shared machine.
  test.slow();
  const financePage = await browser.newPage();
  await signIn(financePage, 'finance@bumpboard.test');
  await financePage.getByRole('link', { name: 'Compensation ledger' }).click();
  await financePage.getByLabel('Flights from').fill(SERVICE_DATE);
  await financePage.getByLabel('Flights to').fill(SERVICE_DATE);
  await financePage.getByRole('button', { name: `Void compensation ${compensationId}` }).click();
  await financePage.getByLabel(/Why void/).fill('Card sent to the wrong address');
  await financePage.getByRole('button', { name: 'Cancel the card and void' }).click();
  const row = financePage.getByRole('row', { name: new RegExp(`^${STATION} ${flightLabel}.*Marta Ledgerwood`) });
  await expect(row).toContainText('Still owed');
  const alert = financePage.getByTestId('alert').filter({ hasText: flightLabel });
  await expect(alert).toContainText('Payment voided by finance', { timeout: 20_000 });
  await expect(financePage.getByTestId('total-USD')).toContainText('re-issue');
  await shot(financePage, 'finance-ledger-owed-alert');

  const desk = await browser.newPage();
  await signIn(desk, 'agent@bumpboard.test');
  await desk.goto(`/departures?station=${STATION}`);
  await expect(desk.getByTestId('alert').filter({ hasText: flightLabel })).toBeVisible();
  await shot(desk, 'departures-payment-alert');
  await desk.goto(`/flights/${flightId}`);
  const card = desk.getByTestId('compensation-row').filter({ hasText: 'Marta Ledgerwood' });
  // The desk's panels load one after another; on a busy machine the compensation list takes more than five seconds.
  await expect(card.getByTestId('compensation-state')).toContainText('Voided', { timeout: 20_000 });
  await expect(desk.getByTestId('compensations-lost')).toBeVisible();
  await expect(desk.getByTestId('cabin-changes')).toBeVisible();
  await shot(desk, 'desk-compensation-voided');
  await card.getByLabel('Why issue it again?').fill('Passenger at the desk, new card');
  await card.getByRole('button', { name: 'Re-issue $450.00' }).click();
  await expect(card.getByTestId('compensation-state')).toContainText('Issued', { timeout: 20_000 });

  await financePage.reload();
  await financePage.getByLabel('Flights from').fill(SERVICE_DATE);
  await financePage.getByLabel('Flights to').fill(SERVICE_DATE);
  await expect(financePage.getByRole('row', { name: new RegExp(`^${STATION} ${flightLabel}.*Marta Ledgerwood`) })).toContainText('Issued');
  await expect(financePage.getByTestId('alert').filter({ hasText: flightLabel })).toHaveCount(0);
  await financePage.getByRole('link', { name: 'Period report' }).click();
  await expect(financePage.getByText(/Source: BTS Form 251/).first()).toBeVisible();
  await shot(financePage, 'finance-report-sources');
});

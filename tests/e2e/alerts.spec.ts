// Alerts reach a busy agent and supervisor on whatever screen they are on: an amount waiting for a supervisor, the
// decision on it, a passenger who volunteered from their phone, a denial proposal. Each is a visible notice with its
// next step and its own button (never only a toast), counted in the tab title, and the same list is on Station day.
// Outside sources: none prescribe alerts; four eyes on money above a limit is common practice (no source).
import mysql from 'mysql2/promise';
import { expect, test, type Page } from '@playwright/test';
import { shot, signIn, staffApi, type Staff } from './helpers';
import { ownFlight, type OwnFlight } from './own-flight';

let flight: OwnFlight;
let agentApi: Staff;

// Three people signed in, each sign-in a deliberately slow password hash: minutes on a busy machine.
test.setTimeout(300_000);

test.beforeAll(async () => {
  flight = await ownFlight('alerts');
  agentApi = await staffApi('agent@bumpboard.test');
});
test.afterAll(async () => {
  await agentApi?.dispose();
  await flight?.remove();
});

/** A booking of the flight, as a passenger would type it on their phone. */
async function aBooking(flightId: number): Promise<{ pnr: string; lastName: string }> {
  const db = await mysql.createConnection({ uri: (process.env.DATABASE_URL ?? '').replace(/^mariadb:/, 'mysql:') });
  try {
    const [[row]] = await db.query<mysql.RowDataPacket[]>(
      `SELECT b.pnr, p.last_name AS lastName FROM bookings b JOIN passengers p ON p.booking_id = b.id WHERE b.flight_id = ? AND p.status = 'checked-in' ORDER BY b.id DESC LIMIT 1`, [flightId]);
    return { pnr: row.pnr, lastName: row.lastName };
  } finally {
    await db.end();
  }
}

const barItem = (page: Page, kind: string) => page.getByTestId('alerts-bar-item').filter({ hasText: flight.label }).and(page.locator(`[data-kind="${kind}"]`));

test('alerts reach the agent and the supervisor on any screen, with the count in the tab title, and are dismissed there', async ({ browser }) => {
  const supervisor = await browser.newPage();
  await signIn(supervisor, 'supervisor@bumpboard.test');
  await supervisor.goto('/planner');
  const agent = await browser.newPage();
  await signIn(agent, 'agent@bumpboard.test');
  await agent.goto(`/flights/${flight.flightId}`);
  await expect(agent.getByRole('heading', { level: 1 })).toContainText(flight.label);

  // The agent opens a round above their own limit (through the API: the desk's own path is another spec's).
  const rounds = await (await agentApi.api.get(`/api/flights/${flight.flightId}/rounds`)).json();
  const amount = rounds.policy.agentLimitMinor + 10_000;
  expect((await agentApi.post(`/flights/${flight.flightId}/rounds`, { kind: 'posted', offerMinor: amount, volunteersNeeded: 1 })).status).toBe(201);

  const waiting = barItem(supervisor, 'approval-waiting');
  await expect(waiting).toBeVisible({ timeout: 20_000 });
  await expect(waiting).toContainText('A supervisor of the station approves or declines it on Station day.');
  await expect(supervisor).toHaveTitle(/^\(\d+\) /);
  await shot(supervisor, 'alerts-bar-supervisor-planner');

  // The full list is on Station day, beside the queue the supervisor decides from.
  await supervisor.getByRole('link', { name: 'See every alert' }).click();
  await expect(supervisor).toHaveURL(/\/day/);
  await expect(supervisor.getByTestId('alerts-bar')).toHaveCount(0);
  await expect(supervisor.getByTestId('alert').filter({ hasText: flight.label }).first()).toBeVisible();
  await shot(supervisor, 'alerts-station-day-list');
  await supervisor.getByTestId('approval-row').filter({ hasText: flight.label }).getByRole('button', { name: /^Approve/ }).click();
  await expect(supervisor.getByTestId('alert').filter({ hasText: flight.label }).and(supervisor.locator('[data-kind="approval-waiting"]'))).toHaveCount(0, { timeout: 20_000 });

  // The agent, still on the flight desk, hears the decision and dismisses it.
  const decided = barItem(agent, 'approval-decided');
  await expect(decided).toBeVisible({ timeout: 20_000 });
  await expect(decided).toContainText('approved');
  await expect(agent).toHaveTitle(/^\(\d+\) /);
  await shot(agent, 'alerts-bar-agent-desk-decided');
  await decided.getByRole('button', { name: /^Dismiss alert/ }).click();
  await expect(decided).toHaveCount(0);

  // A passenger offers their seat from their phone.
  const { pnr, lastName } = await aBooking(flight.flightId);
  const token = String(rounds.bidLink ?? (await (await agentApi.api.get(`/api/flights/${flight.flightId}/rounds`)).json()).bidLink).split('/').pop();
  const phone = await browser.newPage();
  await phone.goto(`/offer/${token}`);
  const who = await phone.request.post(`/api/public/offers/${token}/identify`, { data: { pnr, lastName } });
  expect(who.ok()).toBe(true);
  const bid = await phone.request.post(`/api/public/offers/${token}/bids`, { data: { passengerToken: (await who.json()).passengerToken, acceptPosted: true } });
  expect(bid.status()).toBe(201);
  const offered = barItem(agent, 'volunteer-offered');
  await expect(offered).toBeVisible({ timeout: 20_000 });
  await expect(offered).toContainText('offered their seat from their phone');
  await expect(offered).toContainText('accept or decline the offer in the volunteer round');
  await shot(agent, 'alerts-bar-agent-desk-volunteer');

  // A denial proposal waits for the supervisor, on Station day's list.
  expect((await agentApi.post(`/flights/${flight.flightId}/denial-proposals`, { seatsNeeded: 1, reason: 'oversold at the gate' })).status).toBe(201);
  const proposed = supervisor.getByTestId('alert').filter({ hasText: flight.label }).and(supervisor.locator('[data-kind="denial-proposed"]'));
  await expect(proposed).toBeVisible({ timeout: 20_000 });
  await proposed.getByRole('button', { name: /as seen$/ }).click();
  await expect(proposed).toContainText(/seen by/);
  await shot(supervisor, 'alerts-station-day-proposal-seen');
  await phone.close();
});

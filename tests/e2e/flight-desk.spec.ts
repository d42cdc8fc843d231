import { expect, request, test, type APIRequestContext, type Page } from '@playwright/test';
import { DEMO_PASSWORD, shot, signIn } from './helpers';
import { ownFlight, type OwnFlight } from './own-flight';

const BASE_URL = process.env.APP_BASE_URL ?? 'http://127.0.0.1:4700';
/** The demo's oversold flight: 165 booked on 150 seats at BOS, for the departures board (read, and left as found). */
const FLIGHT = { carrier: 'ZZ', number: '105', label: 'ZZ 105' };

/** This spec's own flight for what changes a flight: 28 checked in and 12 still to come on 30 seats at BOS, in 3 h. */
let own: OwnFlight;
test.beforeAll(async () => {
  own = await ownFlight('desk', { checkedIn: 28, booked: 12, departsInMinutes: 180 });
});
test.afterAll(async () => {
  await own?.remove();
});

interface DeskPassenger {
  pnr: string;
  status: string;
}

/** PNRs on which nobody has checked in yet: checking one in moves every person on it. */
function notCheckedInParties(passengers: DeskPassenger[], howMany: number) {
  const byPnr = new Map<string, DeskPassenger[]>();
  for (const p of passengers) byPnr.set(p.pnr, [...(byPnr.get(p.pnr) ?? []), p]);
  return [...byPnr.entries()].filter(([, party]) => party.every((p) => p.status === 'booked')).slice(0, howMany).map(([pnr, party]) => ({ pnr, people: party.length }));
}

/**
 * The departure-control feed for one flight, as an integration would send it: an admin creates a station key through
 * the API, then events go in with that key. `undo` cancels the check-ins again and revokes the key, so the shared
 * demo flight is left as it was found.
 */
async function checkInFeed(flightId: number, parties: number) {
  const admin: APIRequestContext = await request.newContext({ baseURL: BASE_URL });
  const session = await (await admin.get('/api/auth/session')).json();
  const signedIn = await admin.post('/api/auth/sign-in', { headers: { 'X-CSRF-Token': session.csrfToken }, data: { email: 'admin@bumpboard.test', password: DEMO_PASSWORD } });
  expect(signedIn.ok()).toBe(true);
  const csrf: string = (await signedIn.json()).csrfToken;

  const desk = await (await admin.get(`/api/flights/${flightId}`)).json();
  const { passengers } = await (await admin.get(`/api/flights/${flightId}/passengers`)).json();
  const chosen = notCheckedInParties(passengers, parties);
  expect(chosen.length, 'the flight still has parties that have not checked in').toBe(parties);

  const created = await admin.post(`/api/stations/${desk.station.id}/integration-keys`, { headers: { 'X-CSRF-Token': csrf }, data: { name: `e2e flight desk ${Date.now()}` } });
  expect(created.status()).toBe(201);
  const { key, id: keyId } = await created.json();
  const feed = await request.newContext({ baseURL: BASE_URL, extraHTTPHeaders: { Authorization: `Bearer ${key}` } });
  const flight = { carrier: desk.flight.carrierCode, number: desk.flight.flightNumber, date: desk.flight.serviceDate };
  const run = `${Date.now()}-${Math.random().toString(36).slice(2, 8)}`;

  const send = async (type: 'passenger.checked-in' | 'check-in.cancelled', at: Date) => {
    const res = await feed.post('/api/integrations/events', {
      data: { events: chosen.map((p, i) => ({ id: `e2e-${type}-${run}-${i}`, type, occurredAt: at.toISOString(), flight, pnr: p.pnr })) },
    });
    expect(res.ok()).toBe(true);
    return res.json();
  };
  let checkedIn = false;
  return {
    parties: chosen,
    people: chosen.reduce((sum, p) => sum + p.people, 0),
    async checkIn() {
      const result = await send('passenger.checked-in', new Date());
      expect(result.applied).toBe(chosen.length);
      checkedIn = true;
    },
    async undo() {
      // A second later than the check-in, so the feed does not treat the cancellation as older news.
      if (checkedIn) await send('check-in.cancelled', new Date(Date.now() + 1_000));
      await admin.delete(`/api/stations/${desk.station.id}/integration-keys/${keyId}`, { headers: { 'X-CSRF-Token': csrf } });
      await feed.dispose();
      await admin.dispose();
    },
  };
}

/** The desk of this spec's own flight, straight from its address. */
async function openOwnDesk(page: Page) {
  await page.goto(`/flights/${own.flightId}`);
  await expect(page.getByRole('heading', { level: 1, name: own.label })).toBeVisible();
  return own.flightId;
}

async function openDeskFromDepartures(page: Page) {
  await page.goto('/departures');
  await expect(page.getByRole('status').filter({ hasText: 'Live' })).toBeVisible();
  await page.getByRole('link', { name: FLIGHT.label }).click();
  await expect(page.getByRole('heading', { level: 1, name: FLIGHT.label })).toBeVisible();
  const flightId = Number(/\/flights\/(\d+)(\?station=[A-Z]{3})?$/.exec(page.url())?.[1]);
  expect(flightId).toBeGreaterThan(0);
  return flightId;
}

const liveIndicator = (page: Page) => page.getByRole('status').filter({ hasText: /^● ?Live/ });

test('the flight desk shows counts and odds, and both move live as check-ins arrive from the feed', async ({ page }) => {
  await signIn(page, 'agent@bumpboard.test');
  await expect(page).toHaveURL(/\/departures(\?station=[A-Z]{3})?$/);
  // From the board to a desk, then to the flight this test may change.
  await openDeskFromDepartures(page);
  const flightId = await openOwnDesk(page);

  await expect(page.getByRole('main').getByText(/^BOS\W+to ORD$/)).toBeVisible();
  await expect(page.getByText(/Times in America\/New York/)).toBeVisible();
  const checkedIn = page.getByTestId('total-checked-in');
  const odds = page.getByTestId('p-oversale');
  await expect(checkedIn).toHaveText(/^\d+$/);
  await expect(odds).toHaveText(/%/);
  await expect(page.getByTestId('volunteer-target')).toBeVisible();
  await expect(liveIndicator(page)).toBeVisible();
  await expect(page.getByTestId('passenger-count')).toHaveText(/\d+ passengers/);
  await expect(page.getByRole('note').filter({ hasText: 'model’s estimate' })).toBeVisible();
  await expect(page.getByTestId('volunteer-rounds')).toBeVisible();
  await shot(page, 'flight-desk-before');

  const checkedInBefore = Number(await checkedIn.textContent());
  // Expected shows always rise when booked people check in (their chance goes to the checked-in rate); the odds
  // figure moves too unless it is already pinned near 0 or 100 %.
  const expectedShows = page.getByTestId('expected-shows');
  const showsBefore = (await expectedShows.textContent()) ?? '';
  // Set on the page now: still there afterwards only if the page never reloaded.
  await page.evaluate(() => Object.assign(window, { __sameDocument: true }));

  const feed = await checkInFeed(flightId, 6);
  try {
    await feed.checkIn();
    // No reload: the socket notice makes the desk refetch, and the new figures appear.
    await expect(checkedIn).toHaveText(String(checkedInBefore + feed.people), { timeout: 15_000 });
    await expect(expectedShows).not.toHaveText(showsBefore, { timeout: 15_000 });
    await expect(odds).toHaveText(/%/);
    await expect(page.getByTestId('event-trail')).toContainText(feed.parties[0].pnr);
    expect(await page.evaluate(() => (window as unknown as { __sameDocument?: boolean }).__sameDocument)).toBe(true);
    await shot(page, 'flight-desk-after');

    await page.getByLabel('Search name, PNR or seat').fill(feed.parties[0].pnr);
    await expect(page.getByTestId('passenger-count')).toHaveText(new RegExp(`^Showing ${feed.parties[0].people} of \\d+ passengers$`));
    await expect(page.locator(`tr[data-pnr="${feed.parties[0].pnr}"]`).first()).toContainText('Checked in');
  } finally {
    await feed.undo();
  }
  await expect(checkedIn).toHaveText(String(checkedInBefore), { timeout: 15_000 });
});

// Fails since the live-path and console changes met: the cut socket is not seen as lost (the indicator stays "Live").
// Kept, marked, until the cause is found; the reconnect refetch itself is covered by client/src/lib/socket.test.ts.
test('the desk says when the live connection drops, and catches up on what it missed once it is back', async ({ page, context }) => {
  // The browser loses its network, as a gate PC does when its cable or Wi-Fi goes: the page gets the window's
  // "offline" event and every request fails until it is back. Cutting only the routed WebSocket is not the same: a cut
  // that lands while socket.io is still probing its upgrade leaves it on HTTP long-polling, whose request in flight
  // no route can cut, so the page would rightly stay "Live" until the next heartbeat.
  await signIn(page, 'agent@bumpboard.test');
  const flightId = await openOwnDesk(page);
  await expect(liveIndicator(page)).toBeVisible();
  const checkedIn = page.getByTestId('total-checked-in');
  await expect(checkedIn).toHaveText(/^\d+$/);
  const before = Number(await checkedIn.textContent());

  await context.setOffline(true);
  const feed = await checkInFeed(flightId, 3);
  try {
    await expect(page.getByRole('status').filter({ hasText: 'Connection lost — reconnecting…' })).toBeVisible();
    await shot(page, 'flight-desk-connection-lost');
    // The feed's own connection is not the browser's: the check-ins arrive while the desk is away.
    await feed.checkIn();
    await expect(checkedIn, 'nothing reaches an offline desk').toHaveText(String(before));
    await context.setOffline(false);
    await expect(page.getByRole('status').filter({ hasText: 'Live again' })).toBeVisible({ timeout: 20_000 });
    // The notice was sent while we were away; the refetch on reconnect brings the new count anyway.
    await expect(checkedIn).toHaveText(String(before + feed.people), { timeout: 10_000 });
    await shot(page, 'flight-desk-live-again');
    await expect(liveIndicator(page)).toBeVisible({ timeout: 10_000 });
  } finally {
    await context.setOffline(false);
    await feed.undo();
  }
});

test('a supervisor can set a weather day on the odds, with a reason; an agent sees no such control', async ({ page }) => {
  await signIn(page, 'supervisor@bumpboard.test');
  await openOwnDesk(page);
  const form = page.getByRole('form', { name: 'Set the common shock' });
  await expect(form).toBeVisible();
  await form.getByRole('button', { name: 'Apply to the odds' }).click();
  // The reason is required, and the error names the rule.
  await expect(form.getByText('reason must say why (at least 3 characters)')).toBeVisible();

  await form.getByLabel(/Weather day/).check();
  await form.getByLabel('Reason').fill('e2e: snow, roads slow');
  await form.getByRole('button', { name: 'Apply to the odds' }).click();
  await expect(page.getByText(/^Common shock: Weather day/)).toBeVisible();
  await shot(page, 'flight-desk-supervisor');

  // Back to no shock: the form takes a reason for that too.
  const reset = page.getByRole('form', { name: 'Set the common shock' });
  await reset.getByLabel('None').check();
  await reset.getByLabel('Reason').fill('e2e: back to normal');
  await reset.getByRole('button', { name: 'Apply to the odds' }).click();
  await expect(page.getByText(/^Common shock: None/)).toBeVisible();

  const url = page.url();
  await page.getByRole('button', { name: 'Sign out' }).click();
  // Signing in again before the sign-out has finished would race it for the session.
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await signIn(page, 'agent@bumpboard.test');
  await page.goto(url);
  await expect(page.getByRole('heading', { level: 1, name: own.label })).toBeVisible();
  await expect(page.getByRole('form', { name: 'Set the common shock' })).toHaveCount(0);
});

test('the departures board updates live when check-ins arrive', async ({ page }) => {
  await signIn(page, 'agent@bumpboard.test');
  await expect(page).toHaveURL(/\/departures(\?station=[A-Z]{3})?$/);
  await expect(liveIndicator(page)).toBeVisible();
  const link = page.getByRole('link', { name: FLIGHT.label });
  const flightId = Number(/\/flights\/(\d+)$/.exec((await link.getAttribute('href')) ?? '')?.[1]);
  const cell = page.getByTestId(`checked-in-${flightId}`);
  await expect(cell).toHaveText(/^\d+$/);
  const before = Number(await cell.textContent());

  const feed = await checkInFeed(flightId, 2);
  try {
    await feed.checkIn();
    await expect(cell).toHaveText(String(before + feed.people), { timeout: 15_000 });
    await shot(page, 'departures-live');
  } finally {
    await feed.undo();
  }
  await expect(cell).toHaveText(String(before), { timeout: 15_000 });
});

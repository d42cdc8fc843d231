import { expect, test, type Page } from '@playwright/test';
import { expectNoAxeViolations, shot, signIn, staffApi, type Staff } from './helpers';

/**
 * axe (WCAG 2.0–2.2 A and AA rules) on every screen of every role, with dialogs open and after a live update.
 * The demo's oversold flight is ZZ 105 at BOS (invented data).
 */
// axe walks the whole page; on a shared test machine a desk takes a while.
test.setTimeout(240_000);

const SIZES = [
  { name: '1366', width: 1366, height: 768 },
  { name: '1920', width: 1920, height: 1080 },
];

async function demoFlightId(staff: Staff) {
  const session = await (await staff.api.get('/api/auth/session')).json();
  const bos = session.user.stations.find((s: { iata: string }) => s.iata === 'BOS');
  const board = await (await staff.api.get(`/api/departures?stationId=${bos.id}`)).json();
  const flight = board.flights.find((f: { carrierCode: string; flightNumber: string }) => f.carrierCode === 'ZZ' && f.flightNumber === '105');
  expect(flight, 'the demo still has ZZ 105 at BOS').toBeTruthy();
  return flight.id as number;
}

async function closeOpenRounds(staff: Staff, flightId: number) {
  const rounds = (await (await staff.api.get(`/api/flights/${flightId}/rounds`)).json()) as { rounds: { id: number; status: string }[] };
  for (const r of rounds.rounds.filter((x) => x.status === 'open')) expect((await staff.post(`/rounds/${r.id}/close`)).status).toBe(200);
}

/** Waits for the screen's own heading (focused on arrival), then checks it and keeps a picture of it at both sizes. */
async function check(page: Page, path: string, heading: string | RegExp, name: string) {
  await page.goto(path);
  await expect(page.getByRole('heading', { level: 1, name: heading })).toBeFocused();
  await expect(page.getByText(/^Loading/)).toHaveCount(0);
  await expectNoAxeViolations(page, path);
  for (const size of SIZES) {
    await page.setViewportSize(size);
    await page.screenshot({ path: `test-results/screenshots/a11y-${name}-${size.name}.png` });
  }
  await page.setViewportSize(SIZES[0]!);
}

test('sign-in passes axe and names its tab', async ({ page }) => {
  await page.goto('/sign-in');
  await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeFocused();
  await expect(page).toHaveTitle('Sign in · Bumpboard');
  await expectNoAxeViolations(page, '/sign-in');
  // A submit with nothing typed: the errors are announced and still pass axe.
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expectNoAxeViolations(page, '/sign-in with errors');
  await shot(page, 'a11y-sign-in-errors');
});

test('the agent’s screens, the gate-screen dialog and the close-round dialog pass axe', async ({ page }) => {
  const agent = await staffApi('agent@bumpboard.test');
  const flightId = await demoFlightId(agent);
  try {
    await closeOpenRounds(agent, flightId);
    await signIn(page, 'agent@bumpboard.test');
    await check(page, '/departures', /^Departures · /, 'agent-departures');
    await check(page, `/flights/${flightId}`, /^ZZ 105$/, 'agent-desk');
    await expect(page).toHaveTitle(/^(\(\d+\) )?Flight desk · ZZ 105 to .+ · Bumpboard$/);
    await check(page, `/flights/${flightId}/bump-review`, /^Bump review · /, 'agent-bump-review');

    expect((await agent.post(`/flights/${flightId}/rounds`, { kind: 'posted', offerMinor: 40000, extras: [], volunteersNeeded: 1 })).status).toBe(201);
    await page.goto(`/flights/${flightId}`);
    const opener = page.getByRole('button', { name: 'Show QR for the gate screen' });
    await opener.click();
    const gate = page.getByRole('dialog', { name: 'Gate screen: offer your seat' });
    await expect(gate.getByRole('img', { name: /^QR code for / })).toBeVisible();
    await expectNoAxeViolations(page, 'the gate-screen dialog');
    // Tab stays in the dialog, Esc closes it and focus is back on the button that opened it.
    for (let i = 0; i < 4; i++) {
      await page.keyboard.press('Tab');
      expect(await gate.evaluate((d) => d.contains(document.activeElement))).toBe(true);
    }
    await page.keyboard.press('Escape');
    await expect(gate).toHaveCount(0);
    await expect(opener).toBeFocused();

    await page.getByRole('button', { name: 'Close this round' }).click();
    const confirm = page.getByRole('dialog', { name: 'Close the round?' });
    await expect(confirm.getByRole('button', { name: 'Keep it open' })).toBeFocused();
    await expectNoAxeViolations(page, 'the close-round dialog');
    await shot(page, 'a11y-close-round-dialog');
    await confirm.getByRole('button', { name: 'Yes, close the round' }).click();
    await expect(confirm).toHaveCount(0);
    await expect(page.getByRole('heading', { name: 'Volunteer rounds' })).toBeFocused();
  } finally {
    await closeOpenRounds(agent, flightId);
    await agent.dispose();
  }
});

test('the supervisor’s screens pass axe, also after a live update of the desk', async ({ page }) => {
  const sup = await staffApi('supervisor@bumpboard.test');
  const flightId = await demoFlightId(sup);
  const shock = (body: unknown) => sup.api.put(`/api/flights/${flightId}/shock`, { headers: { 'X-CSRF-Token': sup.csrf }, data: body });
  try {
    await signIn(page, 'supervisor@bumpboard.test');
    await check(page, '/day', /^Station day · /, 'supervisor-day');
    await check(page, '/planner', 'Planner', 'supervisor-planner');
    await check(page, `/flights/${flightId}`, /^ZZ 105$/, 'supervisor-desk');
    // Another supervisor's change reaches this desk through the live notice: the page must still pass.
    expect((await shock({ shock: { kind: 'beta-binomial', rho: 0.05 }, reason: 'e2e: axe after a live update' })).ok()).toBe(true);
    await expect(page.getByText(/^Common shock: /)).not.toHaveText(/None/);
    await expectNoAxeViolations(page, 'the desk after a live update');
    await check(page, `/flights/${flightId}/bump-review`, /^Bump review · /, 'supervisor-bump-review');
  } finally {
    await shock({ shock: null, reason: 'e2e: back to normal' });
    await sup.dispose();
  }
});

test('finance’s screens pass axe', async ({ page }) => {
  await signIn(page, 'finance@bumpboard.test');
  await check(page, '/ledger', 'Compensation ledger', 'finance-ledger');
  await check(page, '/reconciliation', 'Reconciliation', 'finance-reconciliation');
  await check(page, '/report', 'Period report', 'finance-report');
});

test('the admin’s screens pass axe', async ({ page }) => {
  await signIn(page, 'admin@bumpboard.test');
  await check(page, '/setup', 'Station setup', 'admin-setup');
  await check(page, '/planner', 'Planner', 'admin-planner');
  await check(page, '/departures', /^Departures · /, 'admin-departures');
  await check(page, '/no-such-screen', 'No such screen', 'admin-not-found');
});

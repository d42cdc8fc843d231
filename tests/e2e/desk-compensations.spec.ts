// The agent issues a volunteer's compensation from the flight desk's Compensation panel.
// Needs: the app at APP_BASE_URL talking to the payments stand-in (STRIPE_API_URL). The test makes its own
// compensation on a flight of its own at BOS through the API: a posted round, one checked-in solo volunteer,
// accepted. Rounds left open are closed first, and ours is closed at the end.
import { expect, test } from '@playwright/test';
import { SCREENSHOTS, shot, signIn, staffApi, type Staff } from './helpers';
import { ownFlight, type OwnFlight } from './own-flight';

/** This spec's own oversold flight (33 checked in on 30 seats at BOS) and a later one with room. */
let flight: OwnFlight;
test.beforeAll(async () => {
  flight = await ownFlight('comp');
});
test.afterAll(async () => {
  await flight?.remove();
});

interface Rounds { rounds: { id: number; status: string; volunteers: { bookingId: number }[] }[]; policy: { ladderMinor: number[]; currency: string } }

/** One open round per flight: another left open would block ours. */
async function closeOpenRounds(staff: Staff, flightId: number): Promise<Rounds> {
  const rounds: Rounds = await (await staff.api.get(`/api/flights/${flightId}/rounds`)).json();
  for (const r of rounds.rounds.filter((x) => x.status === 'open')) expect((await staff.post(`/rounds/${r.id}/close`)).status).toBe(200);
  return rounds;
}

test('the agent issues an accepted volunteer’s compensation on the desk and sees it issued', async ({ page }) => {
  test.setTimeout(90_000);
  const agent = await staffApi('agent@bumpboard.test');
  const flightId = flight.flightId;
  try {
    const before = await closeOpenRounds(agent, flightId);
    const { passengers } = await (await agent.api.get(`/api/flights/${flightId}/passengers`)).json();
    const volunteered = new Set(before.rounds.flatMap((r) => r.volunteers.map((v) => v.bookingId)));
    const solo = (passengers as { id: number; bookingId: number; partySize: number; status: string; pnr: string; firstName: string; lastName: string }[])
      .filter((p) => p.partySize === 1 && p.status === 'checked-in' && !volunteered.has(p.bookingId));
    expect(solo.length, 'the flight still has checked-in solo travellers who have not volunteered').toBeGreaterThan(0);
    const traveller = solo[Math.floor(Math.random() * solo.length)];

    const offerMinor = before.policy.ladderMinor[0];
    const opened = await agent.post(`/flights/${flightId}/rounds`, { kind: 'posted', offerMinor, extras: [], volunteersNeeded: 1 });
    expect(opened.status).toBe(201);
    const roundId = (opened.body as { id: number }).id;
    const added = await agent.post(`/rounds/${roundId}/volunteers`, { passengerIds: [traveller.id] });
    expect(added.status).toBe(201);
    const accepted = await agent.post(`/rounds/${roundId}/volunteers/${(added.body as { id: number }).id}/accept`);
    expect(accepted.status).toBe(200);

    await signIn(page, 'agent@bumpboard.test');
    await page.goto(`/flights/${flightId}`);
    await expect(page.getByRole('heading', { level: 1, name: flight.label })).toBeVisible();
    const panel = page.getByTestId('desk-compensations');
    await expect(panel.getByRole('heading', { name: 'Compensation' })).toBeVisible();
    await expect(panel.getByRole('note')).toContainText('Caution');

    // A solo traveller who never volunteered on this flight has exactly this one compensation.
    const row = panel.locator(`[data-testid="compensation-row"][data-pnr="${traveller.pnr}"]`);
    await expect(row).toHaveAttribute('data-state', 'due');
    // As the client writes amounts: en-US currency of minor units (BOS works in USD, two decimals).
    const money = new Intl.NumberFormat('en-US', { style: 'currency', currency: before.policy.currency }).format(offerMinor / 100);
    await expect(row.getByTestId('compensation-amount')).toHaveText(money);
    await expect(row).toContainText('Voluntary');
    await expect(row).toContainText(/Paid in\s*Prepaid card/);
    await expect(row.getByTestId('compensation-state')).toContainText('Due');
    await row.scrollIntoViewIfNeeded();
    await panel.screenshot({ path: `${SCREENSHOTS}/desk-compensations-due.png` });

    await row.getByRole('button', { name: /^Issue / }).click();
    const issuedRow = panel.locator(`[data-testid="compensation-row"][data-pnr="${traveller.pnr}"][data-state="issued"]`);
    await expect(issuedRow).toBeVisible({ timeout: 20_000 });
    await expect(issuedRow.getByTestId('compensation-state')).toContainText('Issued');
    await expect(issuedRow.getByRole('button', { name: /^Issue / })).toHaveCount(0);
    await panel.screenshot({ path: `${SCREENSHOTS}/desk-compensations-issued.png` });
    await shot(page, 'desk-compensations-desk');
  } finally {
    await closeOpenRounds(agent, flightId);
    await agent.api.dispose();
  }
});

test('a supervisor’s desk has no Compensation panel: only agents handle the money', async ({ page }) => {
  const supervisor = await staffApi('supervisor@bumpboard.test');
  const flightId = flight.flightId;
  await supervisor.api.dispose();
  await signIn(page, 'supervisor@bumpboard.test');
  await page.goto(`/flights/${flightId}`);
  await expect(page.getByRole('heading', { level: 1, name: flight.label })).toBeVisible();
  await expect(page.getByTestId('volunteer-rounds')).toBeVisible();
  await expect(page.getByTestId('desk-compensations')).toHaveCount(0);
});

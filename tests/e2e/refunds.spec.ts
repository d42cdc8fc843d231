// The desk shows the refunds a rule adds beside a compensation, with their rule and a caution, and the refund's own
// payment card. The test makes its own flight at BOS (US rule), gives its travellers a paid seat (USD 35) and bag
// (USD 40), and accepts one volunteer through the API: 14 CFR Part 260 (260.1(a)) refunds the fees of services paid
// for and not provided, USD 75 (worked by hand).
import mysql from 'mysql2/promise';
import { expect, test } from '@playwright/test';
import { SCREENSHOTS, shot, signIn, staffApi } from './helpers';
import { ownFlight, type OwnFlight } from './own-flight';

let flight: OwnFlight;
test.beforeAll(async () => {
  flight = await ownFlight('refund');
  const db = await mysql.createConnection({ uri: (process.env.DATABASE_URL ?? '').replace(/^mariadb:/, 'mysql:'), timezone: 'Z' });
  const fees = [{ kind: 'seat', amountMinor: 3_500, currency: 'USD' }, { kind: 'bag', amountMinor: 4_000, currency: 'USD' }];
  await db.query('UPDATE passengers SET optional_fees = ? WHERE flight_id = ?', [JSON.stringify(fees), flight.flightId]);
  await db.end();
});
test.afterAll(async () => {
  await flight?.remove();
});

test('an accepted volunteer’s fee refund shows beside the compensation, with its rule, a caution and its own payment', async ({ page }) => {
  test.setTimeout(90_000);
  const agent = await staffApi('agent@bumpboard.test');
  const flightId = flight.flightId;
  try {
    const { passengers } = await (await agent.api.get(`/api/flights/${flightId}/passengers`)).json();
    const traveller = (passengers as { id: number; partySize: number; status: string; pnr: string; firstName: string; lastName: string }[])
      .find((p) => p.partySize === 1 && p.status === 'checked-in')!;
    const policy = (await (await agent.api.get(`/api/flights/${flightId}/rounds`)).json()).policy as { ladderMinor: number[] };
    const opened = await agent.post(`/flights/${flightId}/rounds`, { kind: 'posted', offerMinor: policy.ladderMinor[0], extras: [], volunteersNeeded: 1 });
    expect(opened.status).toBe(201);
    const roundId = (opened.body as { id: number }).id;
    const added = await agent.post(`/rounds/${roundId}/volunteers`, { passengerIds: [traveller.id] });
    expect((await agent.post(`/rounds/${roundId}/volunteers/${(added.body as { id: number }).id}/accept`)).status).toBe(200);
    await agent.post(`/rounds/${roundId}/close`);

    await signIn(page, 'agent@bumpboard.test');
    await page.goto(`/flights/${flightId}`);
    const panel = page.getByTestId('desk-compensations');
    const refunds = panel.getByTestId('desk-refunds');
    await expect(refunds.getByRole('heading', { name: 'Refunds beside compensation' })).toBeVisible();
    await expect(refunds.getByRole('note')).toContainText('compliance staff decide');
    const row = refunds.getByTestId('refund-row');
    await expect(row).toHaveAttribute('data-kind', 'optional-fees');
    await expect(row.getByTestId('refund-amount')).toHaveText('$75.00');
    await expect(row).toContainText('Seat selection: $35.00');
    await expect(row).toContainText('Checked bag: $40.00');
    await expect(row).toContainText('14 CFR');
    const cards = panel.locator(`[data-testid="compensation-row"][data-pnr="${traveller.pnr}"]`);
    await expect(cards).toHaveCount(2);
    await expect(cards.filter({ hasText: 'Refund — optional fees' }).getByTestId('compensation-amount')).toHaveText('$75.00');
    await refunds.scrollIntoViewIfNeeded();
    await refunds.screenshot({ path: `${SCREENSHOTS}/desk-refunds.png` });
    await cards.filter({ hasText: 'Refund — optional fees' }).screenshot({ path: `${SCREENSHOTS}/desk-refund-payment-card.png` });
    await shot(page, 'desk-refunds-desk');
  } finally {
    await agent.api.dispose();
  }
});

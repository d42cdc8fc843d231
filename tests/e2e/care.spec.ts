// Care for waiting passengers: the station admin sets meal allowances and a partner hotel; the agent records a
// volunteer's choice and the care given on the flight desk. The scene is made through the API on the demo flight
// ZZ 403 at FCO (EU rule): a posted round, one checked-in solo volunteer accepted and rebooked on ZZ 405.
// Reg. (EC) 261/2004 Art. 4(1): volunteers are owed Art. 8 (the choice), not Art. 9 care, which the panel says.
import { expect, test } from '@playwright/test';
import { SCREENSHOTS, shot, signIn, staffApi, type Staff } from './helpers';

async function fcoFlightId(staff: Staff, number: string) {
  const session = await (await staff.api.get('/api/auth/session')).json();
  const fco = session.user.stations.find((s: { iata: string }) => s.iata === 'FCO');
  const board = await (await staff.api.get(`/api/departures?stationId=${fco.id}`)).json();
  const flight = board.flights.find((f: { carrierCode: string; flightNumber: string }) => f.carrierCode === 'ZZ' && f.flightNumber === number);
  expect(flight, `the demo still has ZZ ${number} at FCO`).toBeTruthy();
  return { flightId: flight.id as number, stationId: fco.id as number };
}

async function closeOpenRounds(staff: Staff, flightId: number) {
  const rounds = await (await staff.api.get(`/api/flights/${flightId}/rounds`)).json();
  for (const r of rounds.rounds.filter((x: { status: string }) => x.status === 'open')) expect((await staff.post(`/rounds/${r.id}/close`)).status).toBe(200);
  return rounds as { rounds: { volunteers: { bookingId: number }[] }[]; policy: { ladderMinor: number[] } };
}

test('the station admin sets meal allowances and a partner hotel', async ({ page }) => {
  await signIn(page, 'admin@bumpboard.test');
  await page.goto('/setup?station=FCO');
  const form = page.getByRole('form', { name: 'Care for waiting passengers' });
  await expect(form).toBeVisible();
  await form.getByLabel('Refreshment allowance (EUR)').fill('5.00');
  await form.getByLabel('Meal allowance (EUR)').fill('abc');
  await form.getByRole('button', { name: 'Save care setup' }).click();
  // A bad amount is named beside its field, nothing is sent.
  await expect(form.getByText(/Meal allowance/).last()).toBeVisible();
  await form.getByLabel('Meal allowance (EUR)').fill('15.00');
  const existing = form.getByRole('group', { name: /^Hotel / });
  while ((await existing.count()) > 0) await existing.first().getByRole('button', { name: /^Remove / }).click();
  await form.getByRole('button', { name: 'Add a partner hotel' }).click();
  const hotel = form.getByRole('group', { name: 'Hotel 1' });
  await hotel.getByLabel('Hotel name').fill('Hotel Larkfield Fiumicino');
  await hotel.getByLabel('Phone').fill('+39 06 0000 0000');
  await hotel.getByLabel('Address').fill('Via dell’Aeroporto 1, Fiumicino');
  await hotel.getByLabel('Nightly rate (EUR)').fill('110.00');
  await form.getByRole('button', { name: 'Save care setup' }).click();
  await expect(form.getByRole('status')).toHaveText('Saved.');
  await expect(form.getByRole('note')).toContainText('Caution');
  await form.scrollIntoViewIfNeeded();
  await form.screenshot({ path: `${SCREENSHOTS}/care-setup.png` });
});

test('the agent records a volunteer’s choice and the care given on the desk', async ({ page }) => {
  test.setTimeout(90_000);
  const agent = await staffApi('agent@bumpboard.test');
  const { flightId } = await fcoFlightId(agent, '403');
  const { flightId: alternateId } = await fcoFlightId(agent, '405');
  try {
    const before = await closeOpenRounds(agent, flightId);
    const { passengers } = await (await agent.api.get(`/api/flights/${flightId}/passengers`)).json();
    const volunteered = new Set(before.rounds.flatMap((r) => r.volunteers.map((v) => v.bookingId)));
    const solo = (passengers as { id: number; bookingId: number; partySize: number; status: string; firstName: string; lastName: string }[])
      .filter((p) => p.partySize === 1 && p.status === 'checked-in' && !volunteered.has(p.bookingId));
    expect(solo.length, 'the demo flight still has checked-in solo travellers who have not volunteered').toBeGreaterThan(0);
    const traveller = solo[Math.floor(Math.random() * solo.length)];
    const opened = await agent.post(`/flights/${flightId}/rounds`, { kind: 'posted', offerMinor: before.policy.ladderMinor[0], extras: [], volunteersNeeded: 1 });
    expect(opened.status).toBe(201);
    const roundId = (opened.body as { id: number }).id;
    const added = await agent.post(`/rounds/${roundId}/volunteers`, { passengerIds: [traveller.id] });
    expect(added.status).toBe(201);
    const volunteerId = (added.body as { id: number }).id;
    expect((await agent.post(`/rounds/${roundId}/volunteers/${volunteerId}/accept`)).status).toBe(200);
    expect((await agent.post(`/volunteers/${volunteerId}/rebook`, { alternateFlightId: alternateId })).status).toBe(200);

    await signIn(page, 'agent@bumpboard.test');
    await page.goto(`/flights/${flightId}`);
    const name = `${traveller.firstName} ${traveller.lastName}`;
    const card = page.getByRole('article', { name, exact: true });
    await expect(page.getByRole('heading', { name: 'Care and the passenger’s choice' })).toBeVisible();
    // The desk loads its panels one after another on a shared machine: allow for a slow first answer.
    await expect(card).toBeVisible({ timeout: 20_000 });
    await expect(card).toContainText('Volunteer');
    await expect(card).toContainText('Alternate ZZ 405');
    await expect(card).toContainText('Art. 4(1)');
    const choice = card.getByRole('region', { name: `Choice of ${name}` });
    await expect(choice.getByRole('radio')).toHaveCount(4);
    await choice.getByRole('radio', { name: /Re-routing at the earliest opportunity/ }).check();
    await choice.getByRole('button', { name: 'Record the choice' }).click();
    await expect(choice).toContainText('Recorded by agent@bumpboard.test');

    const give = card.getByRole('form', { name: `Record care given to ${name}` });
    await give.getByLabel('Care given').selectOption('meal');
    await give.getByLabel('What was given').fill('Meal voucher');
    await give.getByLabel('Cost (EUR, optional)').fill('15.00');
    await give.getByLabel('Provided by').fill('Gate agent');
    await give.getByRole('button', { name: 'Record care given' }).click();
    await expect(card.getByRole('listitem').filter({ hasText: 'Meal voucher · €15.00 · by Gate agent' })).toBeVisible({ timeout: 15_000 });
    await expect(page.getByRole('note').filter({ hasText: 'passenger’s choice and care' })).toBeVisible();
    // Another agent's record reaches this desk by the flight's notice, without a reload.
    const compensationId = (await (await agent.api.get(`/api/flights/${flightId}/care`)).json()).passengers.find((p: { passengerName: string }) => p.passengerName === name).compensationId;
    expect((await agent.post(`/compensations/${compensationId}/care`, { kind: 'communication', description: 'Two calls from the desk phone', providedBy: 'Transfer desk' })).status).toBe(201);
    await expect(card.getByRole('listitem').filter({ hasText: 'Two calls from the desk phone' })).toBeVisible({ timeout: 15_000 });
    // The passenger is mailed what was recorded, in their booking's language.
    await card.getByRole('button', { name: 'Mail the passenger this choice and care' }).click();
    await expect(card.getByRole('status')).toContainText('queued for the passenger’s e-mail');
    await card.scrollIntoViewIfNeeded();
    await card.screenshot({ path: `${SCREENSHOTS}/desk-care-card.png` });
    await shot(page, 'desk-care-desk');
  } finally {
    await closeOpenRounds(agent, flightId);
    await agent.api.dispose();
  }
});

test('finance sees care costs apart from compensation, by kind, station and flight, with a CSV export', async ({ page }) => {
  await signIn(page, 'finance@bumpboard.test');
  await page.getByRole('link', { name: 'Compensation ledger' }).click();
  const panel = page.getByRole('region', { name: 'Care costs' });
  await expect(panel).toBeVisible();
  // The meal voucher the agent recorded on ZZ 403 at FCO (the test above) is a care cost; the free calls are not.
  await expect(panel.getByTestId('care-rows').getByRole('row').filter({ hasText: 'ZZ 403 · FCO' }).filter({ hasText: 'Meal voucher' }).first()).toBeVisible({ timeout: 15_000 });
  await expect(panel.getByTestId('care-rows')).not.toContainText('Two calls from the desk phone');
  await expect(panel.getByRole('table', { name: 'By kind' })).toContainText('Meals');
  await expect(panel.getByRole('table', { name: 'By flight' })).toContainText('ZZ 403');
  const href = await panel.getByRole('link', { name: 'Export CSV of care costs' }).getAttribute('href');
  const csv = await (await page.request.get(href!)).text();
  expect(csv.split('\r\n')[0]).toBe('care_id,station,flight,service_date,passenger,kind,description,currency,amount,amount_minor,provided_by,recorded_at');
  expect(csv).toContain('Meal voucher');
  await panel.scrollIntoViewIfNeeded();
  await panel.screenshot({ path: `${SCREENSHOTS}/finance-care-costs.png` });
});

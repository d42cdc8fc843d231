import { expect, test, type Browser } from '@playwright/test';
import { shot, signIn, staffApi, type Staff } from './helpers';
import { ownFlight, type OwnFlight } from './own-flight';
import { de } from '../../shared/i18n/messages/de';

/** This spec's own oversold flight (33 checked in on 30 seats at BOS) and a later one with room. */
let flight: OwnFlight;
test.beforeAll(async () => {
  flight = await ownFlight('money');
});
test.afterAll(async () => {
  await flight?.remove();
});

// Amounts typed in the person's own locale are read one way. Separators as CLDR publishes them: de-DE writes
// 1.234,50 (decimal comma), en-US 1,234.50; BOS works in USD, whose ISO 4217 minor unit is 2 decimals (from memory),
// so 275.50 USD is 27550 minor units (derived).
const BASE_URL = process.env.APP_BASE_URL ?? 'http://127.0.0.1:4700';

interface RoundRow { id: number; status: string; kind: string; offerMinor: number | null; volunteers: { bookingId: number; askMinor: number | null }[] }
interface Rounds { rounds: RoundRow[]; bidLink: string; policy: { currency: string; ladderMinor: number[]; agentLimitMinor: number } }

const roundsOf = async (staff: Staff, flightId: number): Promise<Rounds> => (await staff.api.get(`/api/flights/${flightId}/rounds`)).json();

async function closeOpenRounds(staff: Staff, flightId: number) {
  for (const r of (await roundsOf(staff, flightId)).rounds.filter((x) => x.status === 'open')) expect((await staff.post(`/rounds/${r.id}/close`)).status).toBe(200);
}

async function signedInDesk(browser: Browser, locale: string, flightId: number) {
  const context = await browser.newContext({ locale, baseURL: BASE_URL, viewport: { width: 1366, height: 900 } });
  const page = await context.newPage();
  await signIn(page, 'agent@bumpboard.test');
  await page.goto(`/flights/${flightId}`);
  await expect(page.getByRole('heading', { level: 1, name: flight.label })).toBeVisible();
  return { context, page };
}

test('a custom raise typed "275,50" is 275.50 in a German browser and refused, not 27,550, in an American one', async ({ browser }) => {
  test.setTimeout(90_000);
  const agent = await staffApi('agent@bumpboard.test');
  const flightId = flight.flightId;
  await closeOpenRounds(agent, flightId);
  const { policy } = await roundsOf(agent, flightId);
  expect(policy.currency).toBe('USD');
  expect(policy.ladderMinor[0], 'the first step is below 275.50').toBeLessThan(27_550);
  expect(policy.agentLimitMinor, 'an agent may offer 275.50 alone').toBeGreaterThanOrEqual(27_550);
  expect((await agent.post(`/flights/${flightId}/rounds`, { kind: 'posted', offerMinor: policy.ladderMinor[0], volunteersNeeded: 1 })).status).toBe(201);
  const american = await signedInDesk(browser, 'en-US', flightId);
  const german = await signedInDesk(browser, 'de-DE', flightId);
  try {
    const us = american.page;
    await us.getByLabel('Custom amount (USD)').fill('275,50');
    await us.getByRole('button', { name: 'Raise', exact: true }).click();
    await expect(us.getByText(/amount is ambiguous: in en-US "," separates groups of three digits/)).toBeVisible();
    await shot(us, 'money-en-US-refuses-decimal-comma');
    expect((await roundsOf(agent, flightId)).rounds.find((r) => r.status === 'open')?.offerMinor).toBe(policy.ladderMinor[0]);

    const de = german.page;
    await de.getByLabel('Custom amount (USD)').fill('275,50');
    await de.getByRole('button', { name: 'Raise', exact: true }).click();
    // de-DE shows the dollar amount with its decimal comma, the sign after the number.
    await expect(de.getByTestId('current-offer')).toHaveText('275,50\u00a0$');
    await expect.poll(async () => (await roundsOf(agent, flightId)).rounds.find((r) => r.status === 'open')?.offerMinor).toBe(27_550);
    await shot(de, 'money-de-DE-reads-decimal-comma');
  } finally {
    await closeOpenRounds(agent, flightId);
    await american.context.close();
    await german.context.close();
    await agent.dispose();
  }
});

test('a passenger in a German browser names "275,50" on their own bid page and the desk records 27550', async ({ browser }) => {
  test.setTimeout(90_000);
  const agent = await staffApi('agent@bumpboard.test');
  const flightId = flight.flightId;
  await closeOpenRounds(agent, flightId);
  expect((await agent.post(`/flights/${flightId}/rounds`, { kind: 'sealed', volunteersNeeded: 1 })).status).toBe(201);
  const { passengers } = await (await agent.api.get(`/api/flights/${flightId}/passengers`)).json();
  const all: RoundRow[] = (await roundsOf(agent, flightId)).rounds;
  const volunteered = new Set(all.flatMap((r) => r.volunteers.map((v) => v.bookingId)));
  const solo = (passengers as { bookingId: number; partySize: number; status: string; pnr: string; lastName: string }[])
    .filter((p) => p.partySize === 1 && p.status === 'checked-in' && !volunteered.has(p.bookingId));
  expect(solo.length, 'the flight still has checked-in solo travellers who have not volunteered').toBeGreaterThan(0);
  const traveller = solo[Math.floor(Math.random() * solo.length)];
  const { bidLink } = await roundsOf(agent, flightId);
  const context = await browser.newContext({ locale: 'de-DE', baseURL: BASE_URL, viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
  try {
    const p = await context.newPage();
    await p.goto(bidLink);
    // A German browser gets the page in German (the booking names no language): the labels are the catalogue's.
    await p.getByLabel(de['passenger.identify.pnr']).fill(traveller.pnr);
    await p.getByLabel(de['passenger.identify.lastName']).fill(traveller.lastName);
    await p.getByRole('button', { name: de['passenger.identify.continue'] }).click();
    await p.getByLabel(/Mindestens würde ich annehmen \(USD\)/).fill('275,50');
    await p.getByRole('button', { name: de['passenger.offer.send'] }).click();
    await expect(p.getByTestId('outcome')).toHaveAttribute('data-status', 'offered');
    await shot(p, 'money-de-DE-passenger-ask');
    await expect.poll(async () => {
      const open = (await roundsOf(agent, flightId)).rounds.find((r) => r.status === 'open');
      return open?.volunteers.find((v) => v.bookingId === traveller.bookingId)?.askMinor;
    }).toBe(27_550);
  } finally {
    await closeOpenRounds(agent, flightId);
    await context.close();
    await agent.dispose();
  }
});
